import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { formatDay } from '@/components/items/format-dates';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { TextLink } from '@/components/ui/text-link';
import { isApiError } from '@/hooks/api-client';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useActionDoneMutation, useIncidentQuery, type Incident } from '@/hooks/use-incidents';
import { useCurrentUser } from '@/hooks/use-session';
import { ERROR_CODES } from '@/shared/errors';
import { incidentSeverityWords } from '@/shared/schemas/incidents';

import { incidentHeadline, severityHazard, severityLabel, statusLabel } from './incident-words';
import { ReviewForm } from './review-form';

/** One report: what happened, the gear and booking, photos, and the review (the officer records it here). */
export function IncidentScreen({ id, sent }: { id: number; sent: boolean }) {
  const incident = useIncidentQuery(id);
  const { isWide } = useBreakpoints();
  const missing = !Number.isInteger(id) || id <= 0 || (isApiError(incident.error) && incident.error.code === ERROR_CODES.notFound);
  return (
    <Screen testID="incident-screen" title={incident.data ? `Incident #${incident.data.id}` : 'Incident'} width={isWide ? 'wide' : 'regular'}>
      <TextLink href="/incidents" label="All incidents" testID="incident-back" />
      {missing ? (
        <EmptyState
          testID="incident-not-found"
          icon="map-marker-question"
          title="No such incident"
          message="There is no report here that you may see. Reports are seen by their reporter, people who booked the gear, and safety staff."
        />
      ) : incident.isPending ? (
        <LoadingState label="Loading the report" />
      ) : incident.isError ? (
        <ErrorState title="The report did not load" error={incident.error} onRetry={() => void incident.refetch()} retrying={incident.isRefetching} />
      ) : (
        <IncidentBody incident={incident.data} sent={sent} isWide={isWide} />
      )}
    </Screen>
  );
}

function IncidentBody({ incident, sent, isWide }: { incident: Incident; sent: boolean; isWide: boolean }) {
  const user = useCurrentUser();
  const isOfficer = user?.role === 'officer';
  const taggedOut = incident.tagOut ? incident.items.filter((i) => i.status === 'out-of-service') : [];
  const facts = (
    <View style={styles.column}>
      {sent ? (
        <Card testID="incident-sent">
          <AppText variant="bodyStrong" accessibilityLiveRegion="polite">
            Thank you. Your report is with the safety officers.
          </AppText>
          {taggedOut.length > 0 ? (
            <AppText testID="incident-sent-tagged-out">{`Taken out of service now: ${taggedOut.map((i) => i.tag).join(', ')}. Nobody can book or release them until they are inspected and put back.`}</AppText>
          ) : null}
        </Card>
      ) : null}
      <Card title={incidentHeadline(incident)}>
        <View style={styles.badges}>
          <HazardBadge level={severityHazard[incident.severity]} detail={severityLabel(incident.severity)} testID="incident-severity-badge" />
          <Badge
            label={statusLabel(incident.status)}
            tone={incident.status === 'closed' ? 'muted' : 'primary'}
            icon={incident.status === 'closed' ? 'check-circle' : 'clock-outline'}
            testID="incident-status"
          />
        </View>
        <AppText variant="small" tone="muted">
          {incidentSeverityWords[incident.severity].definition}
        </AppText>
        <AppText testID="incident-description">{incident.description}</AppText>
        <AppText tone="muted">{`${formatDateTime(incident.occurredAt)} · ${incident.location}`}</AppText>
        <AppText tone="muted">{`Reported by ${incident.reportedBy.name}, ${formatDateTime(incident.createdAt)}`}</AppText>
      </Card>
      <Card title="Gear and booking" flush>
        {incident.items.length === 0 ? (
          <View style={styles.pad}>
            <AppText tone="muted">No gear named.</AppText>
          </View>
        ) : (
          incident.items.map((item, index) => (
            <ListRow
              key={item.id}
              title={`${item.tag} ${item.name}`}
              subtitle={item.status === 'out-of-service' ? 'Out of service' : item.status === 'retired' ? 'Retired' : 'In service'}
              icon={item.status === 'out-of-service' ? 'tag-off' : 'tools'}
              href={{ pathname: '/gear/[id]', params: { id: String(item.id) } }}
              divided={index > 0}
            />
          ))
        )}
        {incident.bookingId ? (
          <ListRow
            title={`Booking #${incident.bookingId}`}
            icon="calendar-check"
            href={{ pathname: '/bookings/[id]', params: { id: String(incident.bookingId) } }}
            divided
          />
        ) : null}
      </Card>
      {incident.photos.length > 0 ? (
        <Card title="Photos" flush>
          {incident.photos.map((photo, index) => (
            <ListRow key={photo.id} title={photo.fileName} icon="image" href={`/api/files/${photo.id}` as never} divided={index > 0} />
          ))}
        </Card>
      ) : null}
    </View>
  );
  const review = (
    <View style={styles.column}>
      <ReviewSummary incident={incident} />
      {isOfficer && incident.status !== 'closed' ? <ReviewForm incident={incident} /> : null}
    </View>
  );
  if (!isWide) {
    return (
      <View style={styles.column}>
        {facts}
        {review}
      </View>
    );
  }
  return (
    <View style={styles.columns}>
      {facts}
      {review}
    </View>
  );
}

function ReviewSummary({ incident }: { incident: Incident }) {
  const user = useCurrentUser();
  const done = useActionDoneMutation();
  return (
    <Card title="Review" testID="incident-review">
      <AppText>{incident.cause ? `Cause: ${incident.cause}` : incident.status === 'closed' ? 'Closed.' : 'No cause recorded yet.'}</AppText>
      {incident.correctiveActions.length === 0 ? (
        <AppText tone="muted">No corrective actions yet.</AppText>
      ) : (
        incident.correctiveActions.map((a) => {
          const mayTick = a.ownerId === user?.id || user?.role === 'officer';
          return (
            <View key={a.id} style={styles.action} testID={`incident-action-${a.id}`}>
              <AppText variant="bodyStrong">{a.action}</AppText>
              <AppText tone="muted">{`${a.ownerName} · due ${formatDay(a.dueOn)}`}</AppText>
              <Badge
                label={a.doneAt ? `Done ${formatDateTime(a.doneAt)}` : a.pastDue ? 'Past due' : 'To do'}
                icon={a.doneAt ? 'check-circle' : a.pastDue ? 'clock-alert' : 'clock-outline'}
                tone={a.doneAt ? 'muted' : 'primary'}
              />
              {mayTick ? (
                <Button
                  label={a.doneAt ? 'Mark not done' : 'Mark done'}
                  variant="secondary"
                  icon={a.doneAt ? 'close' : 'check-circle'}
                  loading={done.isPending && done.variables?.actionId === a.id}
                  onPress={() => done.mutate({ actionId: a.id, done: !a.doneAt })}
                  testID={`incident-action-done-${a.id}`}
                />
              ) : null}
            </View>
          );
        })
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.lg },
  column: { flex: 1, minWidth: 0, gap: spacing.lg },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  pad: { padding: spacing.md },
  action: { gap: spacing.xxs },
});
