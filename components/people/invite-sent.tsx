import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';

/** Confirms an invitation went out, and what the invited person does next. */
export function InviteSent({ person, onDismiss }: { person: { name: string; email: string }; onDismiss: () => void }) {
  const { colors } = useTheme();
  return (
    <View
      testID="people-invite-sent"
      accessibilityRole="alert"
      accessibilityLiveRegion="polite"
      style={[styles.box, { borderColor: colors.primary, backgroundColor: colors.primarySoft }]}
    >
      <View style={styles.row}>
        <Icon name="email-fast" color={colors.onPrimarySoft} />
        <AppText variant="bodyStrong" color={colors.onPrimarySoft} style={styles.flex}>
          Invitation sent to {person.name}
        </AppText>
      </View>
      <AppText color={colors.onPrimarySoft}>
        {person.email} gets a link to set a password; it works once. Until then they appear here as never signed in.
      </AppText>
      <View>
        <Button label="Done" variant="secondary" testID="people-invite-sent-dismiss" onPress={onDismiss} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.xs, padding: spacing.md, borderWidth: borders.control, borderRadius: radii.md },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
  flex: { flex: 1 },
});
