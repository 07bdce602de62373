import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { borders, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { useItemHistoryQuery } from '@/hooks/use-items';
import type { AuditEvent } from '@/shared/schemas/audit';

/** Rows shown before "Show all". */
const FIRST_ROWS = 8;

const ACTION_WORDS: Record<string, string> = {
  'item.created': 'Registered',
  'item.updated': 'Details changed',
  'item.tagged-out': 'Tagged out of service',
  'item.cleared': 'Put back in service',
  'item.retired': 'Retired',
  'item.file-added': 'File added',
  'inspection.pass': 'Inspection passed',
  'inspection.fail': 'Inspection failed',
};

function field(value: unknown, key: string): unknown {
  return typeof value === 'object' && value !== null ? (value as Record<string, unknown>)[key] : undefined;
}

/** One line on what changed, from the entry's before/after (the full record is in the audit trail). */
function detailOf(event: AuditEvent): string | null {
  const text = (value: unknown) => (typeof value === 'string' && value !== '' ? value : null);
  switch (event.action) {
    case 'item.tagged-out':
    case 'item.retired':
      return text(field(event.after, 'statusReason'));
    case 'inspection.pass':
    case 'inspection.fail':
      return text(field(event.after, 'notes'));
    case 'item.file-added':
      return text(field(event.after, 'fileName'));
    case 'item.updated': {
      if (typeof event.before !== 'object' || event.before === null || typeof event.after !== 'object' || event.after === null) return null;
      const before = event.before as Record<string, unknown>;
      const after = event.after as Record<string, unknown>;
      const changed = Object.keys(after).filter((key) => JSON.stringify(before[key]) !== JSON.stringify(after[key]));
      return changed.length > 0 ? `Changed: ${changed.join(', ')}` : null;
    }
    default:
      return null;
  }
}

export function ItemHistoryCard({ itemId }: { itemId: number }) {
  const { colors } = useTheme();
  const history = useItemHistoryQuery(itemId);
  const [showAll, setShowAll] = useState(false);

  return (
    <Card title="History" testID="item-history">
      {history.isPending ? (
        <LoadingState label="Loading history" />
      ) : history.isError ? (
        <ErrorState title="The history did not load" error={history.error} onRetry={() => void history.refetch()} retrying={history.isRefetching} />
      ) : history.data.length === 0 ? (
        <AppText tone="muted">Nothing recorded yet.</AppText>
      ) : (
        <View role="list">
          {(showAll ? history.data : history.data.slice(0, FIRST_ROWS)).map((event, index) => {
            const detail = detailOf(event);
            return (
              <View
                key={event.id}
                role="listitem"
                testID={`item-history-${event.id}`}
                style={[styles.row, index > 0 && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
              >
                <AppText variant="bodyStrong">{ACTION_WORDS[event.action] ?? event.action}</AppText>
                <AppText variant="small" tone="muted">
                  {`${formatDateTime(event.at)} · ${event.actorName ?? 'Voltcrib'}`}
                </AppText>
                {detail ? <AppText variant="small">{detail}</AppText> : null}
              </View>
            );
          })}
        </View>
      )}
      {history.data && history.data.length > FIRST_ROWS && !showAll ? (
        <Button label={`Show all ${history.data.length}`} variant="secondary" icon="chevron-down" onPress={() => setShowAll(true)} />
      ) : null}
      <AppText variant="small" tone="muted">
        From the lab&apos;s append-only audit trail.
      </AppText>
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { gap: spacing.xxs, paddingVertical: spacing.xs },
});
