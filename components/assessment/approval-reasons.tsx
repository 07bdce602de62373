import { StyleSheet, View } from 'react-native';

import { iconSizes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Icon } from '@/components/ui/icon';
import type { Assessment } from '@/shared/schemas/assessment';

import { SourceLine } from './source-line';

/** Whether a safety officer must approve, and each reason in the lab's own terms. */
export function ApprovalReasons({ assessment, testID = 'assessment-approval' }: { assessment: Assessment; testID?: string }) {
  const { colors } = useTheme();
  return (
    <View style={styles.root} testID={testID}>
      {assessment.approvalRequired ? (
        <Badge label="Officer approval required" icon="clipboard-check" tone="primary" testID={`${testID}-required`} />
      ) : (
        <Badge label="No approval needed" icon="check-circle" testID={`${testID}-not-required`} />
      )}
      {assessment.approvalReasons.map((reason) => (
        <View key={reason.code} style={styles.reason} testID={`${testID}-reason-${reason.code}`}>
          <Icon name="chevron-right" size={iconSizes.sm} color={colors.textMuted} />
          <AppText style={styles.reasonText}>{reason.message}</AppText>
        </View>
      ))}
      {assessment.approvalRequired ? null : (
        <AppText variant="small">Within the lab&apos;s approval voltage and energy threshold, and within the HV qualification on record.</AppText>
      )}
      <SourceLine>the lab rules set by the safety officer, and the qualification on record</SourceLine>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.xs },
  reason: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.xxs },
  reasonText: { flex: 1 },
});
