import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import type { Assessment } from '@/shared/schemas/assessment';

import { Fact } from './fact';
import { boundarySourceWords } from './boundary-source';
import { formatKv, formatMetres } from './quantities';
import { SourceLine } from './source-line';

type Boundaries = NonNullable<Assessment['boundaries']>;

/**
 * Where to set the barrier: the larger of the table's two limited approach distances, since a
 * bench setup has both fixed parts and leads that move.
 */
export function barrierDistance(b: Boundaries): { metres: number | null; printed: string } {
  const movable = b.limitedMovableM ?? -1;
  const fixed = b.limitedFixedM ?? -1;
  if (movable < 0 && fixed < 0) return { metres: null, printed: b.limitedMovableImperial };
  return movable >= fixed ? { metres: b.limitedMovableM, printed: b.limitedMovableImperial } : { metres: b.limitedFixedM, printed: b.limitedFixedImperial };
}

/** NFPA 70E approach boundaries for the highest voltage the sources can reach. */
export function BoundariesFacts({ assessment, testID = 'assessment-boundaries' }: { assessment: Assessment; testID?: string }) {
  const b = assessment.boundaries;
  if (!b) {
    return (
      <View style={styles.root} testID={testID}>
        <AppText variant="bodyStrong">
          {`No approach boundaries: ${formatKv(assessment.sourcePeakKv)} is beyond the table. Set up the bay with the lab's licensed HV engineer.`}
        </AppText>
      </View>
    );
  }
  const barrier = barrierDistance(b);
  return (
    <View style={styles.root} testID={testID}>
      <Fact
        testID={`${testID}-barrier`}
        label={`Set the barrier at least this far (for ${formatKv(assessment.sourcePeakKv)}, row ${b.rowLabel})`}
        value={formatMetres(barrier.metres, barrier.printed)}
      />
      <AppText>{`Limited approach, movable conductor: ${formatMetres(b.limitedMovableM, b.limitedMovableImperial)}`}</AppText>
      <AppText>{`Limited approach, fixed part: ${formatMetres(b.limitedFixedM, b.limitedFixedImperial)}`}</AppText>
      <AppText>{`Restricted approach: ${formatMetres(b.restrictedM, b.restrictedImperial)}`}</AppText>
      <SourceLine testID={`${testID}-source`}>{`${boundarySourceWords(b)}. Feet and inches as the table prints them.`}</SourceLine>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.xs },
});
