import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { Fact } from '@/components/assessment/fact';
import { formatSeconds } from '@/components/assessment/quantities';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import type { Assessment } from '@/shared/schemas/assessment';

/**
 * The computed bleed-down time as a countdown the member starts when switching off. A hint only:
 * the residual reading below is what the return is judged on, and the stick goes on regardless.
 */
export function BleedDownCountdown({
  assessment,
  safeResidualV,
  onRunning,
}: {
  assessment: Assessment;
  safeResidualV: number | undefined;
  onRunning?: (running: boolean) => void;
}) {
  const bleed = assessment.bleedDown;
  const [startedAt, setStartedAt] = useState<number | null>(null);
  const [now, setNow] = useState(() => Date.now());

  useEffect(() => {
    if (startedAt === null) return;
    const timer = setInterval(() => setNow(Date.now()), 250);
    return () => clearInterval(timer);
  }, [startedAt]);

  const running = bleed !== null && startedAt !== null && bleed.timeS - (now - startedAt) / 1000 > 0;
  // The return form waits while the output may still be charged.
  useEffect(() => onRunning?.(running), [running, onRunning]);

  if (!bleed) {
    return (
      <View style={styles.root} testID="return-bleed">
        <Fact label="Bleed-down" value="Ground the output now" note={assessment.bleedDownNote} />
      </View>
    );
  }
  const remainingS = startedAt === null ? bleed.timeS : Math.max(0, bleed.timeS - (now - startedAt) / 1000);
  const finished = startedAt !== null && remainingS === 0;
  return (
    <View style={styles.root} testID="return-bleed">
      <Fact
        label={`Switched off? Wait this long for the output to fall below ${safeResidualV ?? '—'} V`}
        value={formatSeconds(bleed.timeS)}
        source={`t = R·C·ln(V₀ / V_safe) from the stored assessment; ${bleed.source}`}
      />
      {startedAt === null ? (
        <Button
          label="Start the countdown"
          icon="timer-sand"
          variant="secondary"
          testID="return-countdown-start"
          onPress={() => {
            setStartedAt(Date.now());
            setNow(Date.now());
          }}
        />
      ) : finished ? (
        <Badge label="Bleed-down time has passed: ground it, then measure" icon="check-circle" tone="primary" testID="return-countdown-done" />
      ) : (
        <AppText variant="title" accessibilityLiveRegion="polite" testID="return-countdown">{`${formatSeconds(remainingS)} left`}</AppText>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
});
