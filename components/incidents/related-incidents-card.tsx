import { router } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { useIncidentsQuery } from '@/hooks/use-incidents';

import { IncidentRow } from './incident-row';

type Subject = ({ itemId: number; bookingId?: never } | { bookingId: number; itemId?: never }) & {
  /** Off where the page already offers "Report a problem" near its top (the item page). */
  withButton?: boolean;
};

/** "Report a problem": the report form with this item or booking already filled in. */
export function ReportProblemButton({ itemId, bookingId }: { itemId?: number; bookingId?: number }) {
  const params = itemId ? { itemId: String(itemId) } : { bookingId: String(bookingId) };
  return (
    <Button
      label="Report a problem"
      icon="alert-octagon"
      variant="secondary"
      onPress={() => router.push({ pathname: '/incidents/new', params })}
      testID="report-problem"
    />
  );
}

/**
 * An item's or a booking's incidents (those the reader may see), with "Report a problem" that
 * opens the report with this item or booking already filled in.
 */
export function RelatedIncidentsCard(subject: Subject) {
  const list = useIncidentsQuery(subject.itemId ? { itemId: subject.itemId } : { bookingId: subject.bookingId });
  const rows = list.data ?? [];
  return (
    <Card title="Incidents" testID="related-incidents">
      {subject.withButton === false ? null : <ReportProblemButton itemId={subject.itemId} bookingId={subject.bookingId} />}
      {list.isPending ? (
        <LoadingState label="Loading incidents" />
      ) : list.isError ? (
        <ErrorState title="Incidents did not load" error={list.error} onRetry={() => void list.refetch()} retrying={list.isFetching} />
      ) : rows.length === 0 ? (
        <AppText tone="muted">{subject.itemId ? 'No incident reported with this item.' : 'No incident reported for this booking.'}</AppText>
      ) : (
        <View style={styles.list}>
          {rows.slice(0, 10).map((incident, index) => (
            <IncidentRow key={incident.id} incident={incident} divided={index > 0} />
          ))}
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { marginHorizontal: -spacing.md },
});
