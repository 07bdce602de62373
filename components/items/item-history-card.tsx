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
import { auditWords } from '@/components/audit/audit-words';

/** Rows shown before "Show all". */
const FIRST_ROWS = 8;

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
            // The same sentences as the audit trail; the item's own page needs no link to itself.
            const words = auditWords(event);
            return (
              <View
                key={event.id}
                role="listitem"
                testID={`item-history-${event.id}`}
                style={[styles.row, index > 0 && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
              >
                <AppText variant="bodyStrong">{words.sentence}</AppText>
                {words.detail ? <AppText variant="small">{words.detail}</AppText> : null}
                <AppText variant="small" tone="muted">
                  {formatDateTime(event.at)}
                </AppText>
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
