import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { formatDateTime } from '@/components/common/format';
import type { Booking } from '@/hooks/use-bookings';

/** Whether an officer's decision covers this booking's current plan, and its conditions. */
export function BookingApproval({ booking }: { booking: Booking }) {
  const { approval } = booking;
  if (!booking.approvalRequired && !approval) return null;
  return (
    <Card title="Approval" testID="booking-approval">
      <View style={styles.lines}>
        {!approval ? (
          <Badge label="Waiting for a safety officer" icon="timer-sand" tone="primary" testID="booking-approval-waiting" />
        ) : !approval.current ? (
          <>
            <Badge label="Earlier decision void" icon="cancel" testID="booking-approval-void" />
            <AppText>{`${approval.officerName} decided on an earlier plan; the plan has changed since, so it needs a new decision.`}</AppText>
          </>
        ) : approval.decision === 'approve' ? (
          <>
            <Badge label={`Approved by ${approval.officerName}`} icon="check-circle" tone="primary" testID="booking-approval-approved" />
            <AppText variant="small" tone="muted">
              {formatDateTime(approval.decidedAt)}
            </AppText>
            {approval.conditions ? (
              <View style={styles.lines}>
                <AppText variant="bodyStrong">Conditions</AppText>
                <AppText testID="booking-approval-conditions">{approval.conditions}</AppText>
              </View>
            ) : (
              <AppText>No conditions.</AppText>
            )}
          </>
        ) : (
          <>
            <Badge label={`Refused by ${approval.officerName}`} icon="close-circle" testID="booking-approval-refused" />
            <AppText variant="small" tone="muted">
              {formatDateTime(approval.decidedAt)}
            </AppText>
            <AppText testID="booking-approval-reason">{approval.reason ?? ''}</AppText>
          </>
        )}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  lines: { gap: spacing.xs },
});
