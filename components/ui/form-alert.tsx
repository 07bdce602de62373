import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon } from './icon';

interface FormAlertProps {
  message: string;
  testID?: string;
}

/** Why a submit failed as a whole (wrong password, too many tries, server away). */
export function FormAlert({ message, testID }: FormAlertProps) {
  const { colors } = useTheme();
  return (
    <View
      testID={testID}
      accessibilityRole="alert"
      accessibilityLiveRegion="assertive"
      style={[styles.alert, { borderColor: colors.errorText, backgroundColor: colors.surface }]}
    >
      <Icon name="alert-circle" color={colors.errorText} />
      <AppText variant="bodyStrong" style={styles.message}>
        {message}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  alert: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: spacing.sm,
    padding: spacing.md,
    borderWidth: borders.control,
    borderLeftWidth: spacing.xs,
    borderRadius: radii.md,
  },
  message: { flex: 1 },
});
