import { StyleSheet, View } from 'react-native';

import { AssessmentSummary } from '@/components/assessment/assessment-summary';
import { formatKv } from '@/components/assessment/quantities';
import { BookingStatusBadge } from '@/components/bookings/booking-status';
import { formatWindow } from '@/components/bookings/booking-time';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { useBookingQuery, type BookingSummary } from '@/hooks/use-bookings';

import { DecisionForm } from './decision-form';

interface ApprovalCardProps {
  summary: BookingSummary;
  /** The officer's own booking: nobody decides on their own test. */
  own: boolean;
  open: boolean;
  onOpen: () => void;
  onDecided: (decision: 'approve' | 'refuse') => void;
}

/** One test waiting for a decision: the plan, its assessment summary and reasons, the decision. */
export function ApprovalCard({ summary, own, open, onOpen, onDecided }: ApprovalCardProps) {
  const detail = useBookingQuery(summary.id);
  const prefix = `approval-${summary.id}`;
  return (
    <Card testID={prefix}>
      <BookingStatusBadge status={summary.status} overdue={summary.overdue} />
      <AppText variant="heading" headingLevel={2}>{`${summary.personName}: up to ${formatKv(summary.plannedKv)}`}</AppText>
      <AppText>{`${formatWindow(detail.data?.startsAt ?? summary.startsAt, detail.data?.endsAt ?? summary.endsAt)} · ${detail.data?.location ?? summary.location}`}</AppText>
      <AppText tone="muted">{detail.data?.purpose ?? summary.purpose}</AppText>
      <AppText variant="small" tone="muted">{`Gear: ${(detail.data?.items.map((i) => i.tag) ?? summary.itemTags).join(', ')}`}</AppText>
      {detail.isPending ? (
        <LoadingState label="Loading the assessment" />
      ) : detail.isError ? (
        <ErrorState title="The assessment did not load" error={detail.error} onRetry={() => void detail.refetch()} retrying={detail.isFetching} />
      ) : (
        <AssessmentSummary assessment={detail.data.assessment} testID={`${prefix}-assessment`} />
      )}
      <ListRow
        title="Open the full booking"
        icon="information"
        href={{ pathname: '/bookings/[id]', params: { id: String(summary.id) } }}
        testID={`${prefix}-open`}
      />
      {own ? (
        <View style={styles.own}>
          <Badge label="Your own booking: needs another officer" icon="account-off" testID={`${prefix}-own`} />
        </View>
      ) : open && detail.data ? (
        // The decision carries the plan version on screen: if the booking changed since, the
        // server refuses (PLAN_CHANGED) and the card reloads what changed.
        <DecisionForm bookingId={summary.id} planVersion={detail.data.planVersion} onDecided={onDecided} />
      ) : (
        <Button label="Decide" icon="clipboard-check" variant="secondary" block testID={`${prefix}-review`} onPress={onOpen} />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  own: { gap: spacing.xs },
});
