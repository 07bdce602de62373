import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { TextLink } from '@/components/ui/text-link';
import { useBenchRunsQuery } from '@/hooks/use-bench-runs';
import type { Booking } from '@/hooks/use-bookings';
import { BEYOND_PLAN_FLAGS } from '@/shared/hv/bench-run';

import { FLAG_WORDS } from './flag-words';
import { runHeadline } from './run-figures';

/**
 * The booking page's view of its bench log: while the gear is out "Add run" is the first thing
 * offered; runs beyond the approved plan are listed by name so an officer reviewing the booking
 * sees them without opening the log.
 */
export function BenchLogSection({ booking }: { booking: Booking }) {
  const router = useRouter();
  const log = useBenchRunsQuery(booking.id);
  if (booking.status !== 'released' && booking.status !== 'returned') return null;
  if (log.isError) return <ErrorState title="The bench log did not load" error={log.error} onRetry={() => void log.refetch()} retrying={log.isFetching} />;
  if (log.isPending) return null;

  const { runs, open } = log.data;
  const beyond = runs.filter((r) => r.flags.some((f) => BEYOND_PLAN_FLAGS.includes(f.code)));
  const flagged = runs.filter((r) => r.flags.length > 0).length;
  const href = `/bookings/${booking.id}/runs` as const;
  return (
    <Card title="Bench log" testID="booking-bench-log">
      {open ? <Button label="Add run" icon="plus" onPress={() => router.push(href)} block testID="booking-add-run" /> : null}
      <AppText testID="booking-bench-log-count">
        {runs.length === 0
          ? 'No runs recorded yet.'
          : `${runs.length} ${runs.length === 1 ? 'run' : 'runs'} recorded${flagged > 0 ? `, ${flagged} flagged` : ''}.`}
      </AppText>
      {beyond.map((run) => (
        <View key={run.id} style={styles.beyond} testID={`booking-run-beyond-${run.number}`}>
          <HazardBadge
            level="danger"
            detail={run.flags
              .filter((f) => BEYOND_PLAN_FLAGS.includes(f.code))
              .map((f) => FLAG_WORDS[f.code].word)
              .join(', ')}
          />
          <AppText variant="small">{runHeadline(run)}</AppText>
        </View>
      ))}
      {runs.length > 0 || !open ? <TextLink label="Open the bench log" href={href} icon="chart-bar" testID="booking-open-bench-log" /> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  beyond: { gap: spacing.xxs },
});
