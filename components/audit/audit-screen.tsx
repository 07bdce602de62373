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

import { dayRange } from './audit-day';
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

const orUndefined = (text: string) => (text === '' ? undefined : text);

/** The append-only trail, newest first, searched by what it is about, a tag, a person and a day; and a check of its chain. */
export function AuditScreen() {
  const { isWide } = useBreakpoints();
  const [entity, setEntity] = useState<Entity>('all');
  const [tag, setTag] = useState('');
  const [person, setPerson] = useState('');
  const [day, setDay] = useState('');
  // Debounced as one string so a new object each render does not restart the timer.
  const settled = JSON.parse(useDebouncedValue(JSON.stringify({ tag: tag.trim(), person: person.trim(), day: day.trim() }), 400)) as {
    tag: string;
    person: string;
    day: string;
  };
  const range = dayRange(settled.day);
  // A one-letter name matches half the lab: wait for a second letter.
  const personFilter = settled.person.length >= 2 ? settled.person : '';
  const events = useAuditInfiniteQuery({
    entity: entity === 'all' ? undefined : entity,
    tag: orUndefined(settled.tag),
    person: orUndefined(personFilter),
    ...(range ? range : {}),
  });
  const rows = events.data?.pages.flatMap((page) => page.events) ?? [];

  return (
    <Screen testID="audit-screen" title="Audit trail" width={isWide ? 'wide' : 'regular'}>
      <VerifyChain />
      <View style={styles.filters}>
        <ChoiceChips label="About" testID="audit-entity" choices={ENTITIES} value={entity} onChange={setEntity} />
        <View style={[styles.fields, isWide && styles.fieldsWide]}>
          <View style={styles.field}>
            <TextField
              label="Gear tag"
              hint="The whole tag or its start, e.g. GST-00"
              value={tag}
              onChangeText={setTag}
              autoCapitalize="characters"
              autoCorrect={false}
              testID="audit-tag"
            />
          </View>
          <View style={styles.field}>
            <TextField
              label="Person"
              hint="Part of a name or e-mail address"
              value={person}
              onChangeText={setPerson}
              autoCorrect={false}
              testID="audit-person"
            />
          </View>
          <View style={styles.field}>
            <TextField
              label="Day"
              hint="YYYY-MM-DD, on your clock"
              value={day}
              onChangeText={setDay}
              inputMode="numeric"
              autoCorrect={false}
              testID="audit-day"
              error={day.trim() !== '' && dayRange(day) === null ? 'Type a real day as YYYY-MM-DD, e.g. 2026-12-03' : undefined}
            />
          </View>
        </View>
      </View>
      {events.isPending ? (
        <LoadingState label="Loading the trail" />
      ) : events.isError ? (
        <ErrorState title="The trail did not load" error={events.error} onRetry={() => void events.refetch()} retrying={events.isFetching} />
      ) : rows.length === 0 ? (
        <EmptyState testID="audit-empty" icon="history" title="No entries" message="Nothing in the trail matches this search." />
      ) : (
        <Card flush testID="audit-list">
          <View role="list">
            {rows.map((event, index) => (
              <AuditEventRow key={event.id} event={event} divided={index > 0} />
            ))}
          </View>
        </Card>
      )}
      <LoadMore
        query={events}
        label="Load older entries"
        loadingLabel="Loading older entries"
        failedText="Older entries did not load. Try again."
        testID="audit-more"
      />
    </Screen>
  );
}

const styles = StyleSheet.create({
  filters: { gap: spacing.md },
  fields: { gap: spacing.md },
  fieldsWide: { flexDirection: 'row' },
  field: { flex: 1 },
});
