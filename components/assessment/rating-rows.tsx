import { StyleSheet, View } from 'react-native';

import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { HazardBadge } from '@/components/ui/hazard-badge';
import type { Assessment } from '@/shared/schemas/assessment';
import { KIND_LABELS } from '@/shared/schemas/items';

import { formatKv, trimNumber } from './quantities';
import { SourceLine } from './source-line';

/** Each item's rating against what the plan needs, with the margin left (or missing). */
/** "5 kV above the plan" / "10 kV below the plan": never a signed "−10 kV over". */
export function marginWords(marginKv: number | null): string {
  if (marginKv === null) return 'margin unknown';
  const size = trimNumber(Math.abs(marginKv), 1);
  if (Number(size) === 0) return 'rated exactly at the plan';
  return marginKv > 0 ? `${size} kV above the plan` : `${size} kV below the plan`;
}

export function RatingRows({ assessment, testID = 'assessment-ratings' }: { assessment: Assessment; testID?: string }) {
  const { colors } = useTheme();
  const marginPct = assessment.plannedKv > 0 ? (assessment.requiredKv / assessment.plannedKv - 1) * 100 : 0;
  return (
    <View style={styles.root} testID={testID}>
      <AppText variant="bodyStrong">{`Every item must be rated for at least ${formatKv(assessment.requiredKv)}`}</AppText>
      {assessment.items.map((item, index) => {
        const fine = item.ratingOk && item.inService && item.inspectionCurrent;
        return (
          <View
            key={item.itemId}
            testID={`${testID}-${item.itemId}`}
            style={[styles.row, index > 0 && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
          >
            <AppText variant="bodyStrong">{`${item.tag} · ${item.name}`}</AppText>
            <AppText variant="small" tone="muted">
              {KIND_LABELS[item.kind]}
            </AppText>
            <AppText>
              {item.ratedKv === null
                ? 'No voltage rating'
                : `Rated ${formatKv(item.ratedKv)} · needs ${formatKv(item.requiredKv)} · ${marginWords(item.marginKv)}`}
            </AppText>
            {fine ? (
              <Badge label="Rated for the plan" icon="check-circle" />
            ) : (
              <HazardBadge level="warning" detail={item.ratingOk ? 'Not ready' : 'Under-rated'} />
            )}
            {item.notes.map((note) => (
              <AppText key={note} variant="small">
                {note}
              </AppText>
            ))}
          </View>
        );
      })}
      <SourceLine>
        {`required = planned ${formatKv(assessment.plannedKv)} × (1 + the lab's ${trimNumber(marginPct, 1)} % rating margin); the rating compared is each item's maximum voltage`}
      </SourceLine>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.xs },
  row: { gap: spacing.xxs, paddingVertical: spacing.sm },
});
