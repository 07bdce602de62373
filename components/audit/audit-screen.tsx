import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { LoadMore } from '@/components/ui/load-more';
import { useDebouncedValue } from '@/hooks/use-assessment';
import { useAuditInfiniteQuery } from '@/hooks/use-audit';
import { useBreakpoints } from '@/hooks/use-breakpoints';

import { AuditEventRow } from './audit-event-row';
import { VerifyChain } from './verify-chain';

const ENTITIES = [
  { value: 'all', label: 'All' },
  { value: 'booking', label: 'Bookings' },
  { value: 'item', label: 'Gear' },
  { value: 'qualification', label: 'Qualifications' },
  { value: 'lab-rules', label: 'Lab rules' },
  { value: 'checklist-template', label: 'Checklists' },
  { value: 'person', label: 'People' },
] as const;
type Entity = (typeof ENTITIES)[number]['value'];

/** The append-only trail, newest first, filtered by what it is about; and a check of its chain. */
export function AuditScreen() {
  const { isWide } = useBreakpoints();
  const [entity, setEntity] = useState<Entity>('all');
  const [id, setId] = useState('');
  const settledId = useDebouncedValue(id.trim(), 400);
  const events = useAuditInfiniteQuery({ entity: entity === 'all' ? undefined : entity, id: settledId === '' ? undefined : settledId });
  const rows = events.data?.pages.flatMap((page) => page.events) ?? [];

  return (
    <Screen testID="audit-screen" title="Audit trail" width={isWide ? 'wide' : 'regular'}>
      <VerifyChain />
      <View style={styles.filters}>
        <ChoiceChips label="About" testID="audit-entity" choices={ENTITIES} value={entity} onChange={setEntity} />
        <TextField label="Record id" hint="A booking, item or person number" value={id} onChangeText={setId} inputMode="numeric" testID="audit-id" autoCorrect={false} />
      </View>
      {events.isPending ? (
        <LoadingState label="Loading the trail" />
      ) : events.isError ? (
        <ErrorState title="The trail did not load" error={events.error} onRetry={() => void events.refetch()} retrying={events.isFetching} />
      ) : rows.length === 0 ? (
        <EmptyState testID="audit-empty" icon="history" title="No entries" message="Nothing in the trail matches this filter." />
      ) : (
        <Card flush testID="audit-list">
          {rows.map((event, index) => (
            <AuditEventRow key={event.id} event={event} divided={index > 0} />
          ))}
        </Card>
      )}
      <LoadMore query={events} label="Load older entries" loadingLabel="Loading older entries" failedText="Older entries did not load. Try again." testID="audit-more" />
    </Screen>
  );
}

const styles = StyleSheet.create({
  filters: { gap: spacing.md },
});
