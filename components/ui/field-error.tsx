import { StyleSheet, View } from 'react-native';

import { iconSizes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon } from './icon';

interface FieldErrorProps {
  message: string;
  /** Lets the field name this text as its description (aria-describedby on the web). */
  nativeID?: string;
  testID?: string;
}

/** What is wrong with a field, under it: an icon and words, so it never rests on colour alone. */
export function FieldError({ message, nativeID, testID }: FieldErrorProps) {
  const { colors } = useTheme();
  return (
    <View style={styles.row}>
      <Icon name="alert-circle" size={iconSizes.sm} color={colors.errorText} />
      <AppText variant="smallStrong" tone="error" nativeID={nativeID} accessibilityLiveRegion="polite" testID={testID}>
        {message}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.xxs },
});
