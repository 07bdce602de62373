import { StyleSheet, View } from 'react-native';

import { InspectionBadge } from '@/components/gear/item-badges';
import { borders, iconSizes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { Icon } from '@/components/ui/icon';
import { LoadingState } from '@/components/ui/loading-state';
import { useInspectionsQuery } from '@/hooks/use-inspections';
import type { Inspection, Item } from '@/shared/schemas/items';

import { formatDay } from './format-dates';
import { formatNumber } from './rating-fields';

export function ItemInspectionsCard({ item }: { item: Item }) {
  const { colors } = useTheme();
  const inspections = useInspectionsQuery(item.id);
  const failed = item.lastInspectionResult === 'fail';
  return (
    <Card title="Inspections" testID="item-inspections">
      {failed ? (
        // A failed inspection is no inspection to count on: the item waits for one that passes.
        <HazardBadge
          level="warning"
          detail={`Failed its last inspection${item.lastInspectedOn ? ` on ${formatDay(item.lastInspectedOn)}` : ''}`}
          testID="item-inspection-failed"
        />
      ) : (
        <InspectionBadge state={item.inspectionState} />
      )}
      <View style={styles.facts}>
        <AppText testID="item-next-due">
          {failed
            ? 'Needs an inspection that passes before it can be used again.'
            : item.nextInspectionDue
              ? `Next due ${formatDay(item.nextInspectionDue)}`
              : 'No inspection on record: due now'}
        </AppText>
        <AppText variant="small" tone="muted" testID="item-next-due-source">
          {item.lastInspectedOn
            ? `Source: last inspection on ${formatDay(item.lastInspectedOn)} plus this item's ${item.inspectionIntervalDays}-day interval.`
            : `Source: this item's ${item.inspectionIntervalDays}-day interval starts at its first inspection.`}
        </AppText>
      </View>
      {inspections.isPending ? (
        <LoadingState label="Loading inspections" />
      ) : inspections.isError ? (
        <ErrorState
          title="The inspections did not load"
          error={inspections.error}
          onRetry={() => void inspections.refetch()}
          retrying={inspections.isRefetching}
        />
      ) : inspections.data.length === 0 ? (
        <AppText tone="muted" testID="item-inspections-empty">
          None recorded yet.
        </AppText>
      ) : (
        <View role="list">
          {inspections.data.map((inspection, index) => (
            <View
              key={inspection.id}
              role="listitem"
              testID={`inspection-${inspection.id}`}
              style={[styles.row, index > 0 && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
            >
              <InspectionRow inspection={inspection} />
            </View>
          ))}
        </View>
      )}
    </Card>
  );
}

function InspectionRow({ inspection }: { inspection: Inspection }) {
  const { colors } = useTheme();
  const passed = inspection.result === 'pass';
  return (
    <>
      <View style={styles.titleRow}>
        <Icon name={passed ? 'check-circle' : 'close-circle'} size={iconSizes.sm} color={passed ? colors.text : colors.errorText} />
        <AppText variant="bodyStrong" color={passed ? colors.text : colors.errorText} testID={`inspection-${inspection.id}-result`}>
          {`${passed ? 'Passed' : 'Failed'} · ${formatDay(inspection.inspectedOn)}`}
        </AppText>
      </View>
      <AppText variant="small" tone="muted">
        {passed
          ? `By ${inspection.inspectorName} · next due ${formatDay(inspection.nextDue)}`
          : `By ${inspection.inspectorName} · tagged out until an inspection passes`}
      </AppText>
      {inspection.readings.map((reading, index) => (
        <AppText key={index} variant="small">
          {`${reading.label}: ${formatNumber(reading.value)} ${reading.unit}`}
        </AppText>
      ))}
      {inspection.notes !== '' ? <AppText variant="small">{inspection.notes}</AppText> : null}
    </>
  );
}

const styles = StyleSheet.create({
  facts: { gap: spacing.xxs },
  row: { gap: spacing.xxs, paddingVertical: spacing.xs },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
});
