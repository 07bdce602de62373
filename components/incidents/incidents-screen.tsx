import { router } from 'expo-router';
import { useState } from 'react';

import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useIncidentsQuery } from '@/hooks/use-incidents';
import { useCurrentUser } from '@/hooks/use-session';
import type { IncidentStatus } from '@/shared/schemas/incidents';

import { IncidentRow } from './incident-row';
import { SeverityGuide } from './severity-guide';

const FILTERS = [
  { value: 'open', label: 'Open' },
  { value: 'under-review', label: 'Under review' },
  { value: 'closed', label: 'Closed' },
  { value: 'all', label: 'All' },
] as const;

type Filter = (typeof FILTERS)[number]['value'];

/**
 * Incidents: the officer's review queue (open first, then under review, then closed) and, for a
 * member, their own reports and those on gear they booked.
 */
export function IncidentsScreen() {
  const user = useCurrentUser();
  const isOfficer = user?.role === 'officer';
  const [filter, setFilter] = useState<Filter>(isOfficer ? 'open' : 'all');
  const list = useIncidentsQuery(filter === 'all' ? {} : { status: filter as IncidentStatus });
  const rows = list.data ?? [];

  return (
    <Screen testID="incidents-screen" title="Incidents">
      <AppText tone="muted">
        {isOfficer
          ? 'Your review queue: move a report to under review, record its cause and corrective actions, then close it.'
          : user?.role === 'manager'
            ? 'Every report in the lab and where its review stands.'
            : 'Your reports and those on gear you have booked.'}
      </AppText>
      <Button label="Report an incident" icon="alert-octagon" block onPress={() => router.push('/incidents/new')} testID="incidents-report" />
      <ChoiceChips label="Show" testID="incidents-filter" choices={FILTERS} value={filter} onChange={setFilter} />
      {list.isPending ? (
        <LoadingState label="Loading incidents" />
      ) : list.isError ? (
        <ErrorState title="The incidents did not load" error={list.error} onRetry={() => void list.refetch()} retrying={list.isFetching} />
      ) : rows.length === 0 ? (
        <EmptyState
          testID="incidents-empty"
          icon="shield-check"
          title="Nothing here"
          message={filter === 'open' ? 'No report is waiting for review.' : 'No incident has been reported here.'}
        />
      ) : (
        <Card flush testID="incidents-list">
          {rows.map((incident, index) => (
            <IncidentRow key={incident.id} incident={incident} divided={index > 0} />
          ))}
        </Card>
      )}
      <Card title="Severities">
        <SeverityGuide />
      </Card>
    </Screen>
  );
}
