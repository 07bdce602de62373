import { router } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { barrierDistance } from '@/components/assessment/boundaries-facts';
import { Fact } from '@/components/assessment/fact';
import { boundarySourceWords } from '@/components/assessment/boundary-source';
import { formatKv, formatMetres, formatSeconds } from '@/components/assessment/quantities';
import { SafetyCaution } from '@/components/assessment/safety-caution';
import { formatDateTime } from '@/components/common/format';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { HazardBadge } from '@/components/ui/hazard-badge';
import type { Booking } from '@/hooks/use-bookings';

/** After release: what to set up before switching on, and the way back (return and make safe). */
export function ReleasedState({ booking }: { booking: Booking }) {
  const a = booking.assessment;
  const barrier = a.boundaries ? barrierDistance(a.boundaries) : null;
  return (
    <View style={styles.root} testID="release-done">
      <Card>
        <HazardBadge level={a.hazard.hazardous ? 'danger' : 'warning'} detail={`Released: up to ${formatKv(a.plannedKv)}`} testID="release-done-badge" />
        <AppText variant="heading" headingLevel={2}>
          {booking.overdue ? 'The window has ended: make the setup safe and return the gear now.' : 'The gear is yours until the end of the window.'}
        </AppText>
        <AppText>{`Released ${booking.releasedAt ? formatDateTime(booking.releasedAt) : ''} · return by ${formatDateTime(booking.endsAt)}`}</AppText>
        {booking.approval?.current && booking.approval.conditions ? (
          <View style={styles.conditions}>
            <AppText variant="bodyStrong">{`Conditions from ${booking.approval.officerName}`}</AppText>
            <AppText testID="release-done-conditions">{booking.approval.conditions}</AppText>
          </View>
        ) : null}
      </Card>
      <Card title="Before you switch on">
        {barrier && a.boundaries ? (
          <Fact
            testID="release-done-barrier"
            label={`Barrier at least this far from live parts (sources up to ${formatKv(a.sourcePeakKv)})`}
            value={formatMetres(barrier.metres, barrier.printed)}
            source={`${boundarySourceWords(a.boundaries)} (row ${a.boundaries.rowLabel}, the larger limited approach distance)`}
          />
        ) : (
          <AppText variant="bodyStrong">No approach boundary could be computed: set up the bay with the lab&apos;s licensed HV engineer.</AppText>
        )}
        {a.bleedDown ? (
          <Fact
            testID="release-done-bleed"
            label="After switching off, wait at least"
            value={formatSeconds(a.bleedDown.timeS)}
            note="Then ground the output with the grounding stick before touching anything."
            source={`t = R·C·ln(V₀ / V_safe); ${a.bleedDown.source}`}
          />
        ) : (
          <Fact testID="release-done-bleed" label="After switching off" value="Ground it at once" note={a.bleedDownNote} />
        )}
      </Card>
      <SafetyCaution cautions={a.cautions} testID="release-done-caution" />
      <Button
        label="Return and make safe"
        icon="keyboard-return"
        block
        testID="release-go-return"
        onPress={() => router.push({ pathname: '/bookings/[id]/return', params: { id: String(booking.id) } })}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.lg },
  conditions: { gap: spacing.xxs },
});
