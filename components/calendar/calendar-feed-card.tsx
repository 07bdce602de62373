import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Checkbox } from '@/components/ui/checkbox';
import { ErrorState, describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { LoadingState } from '@/components/ui/loading-state';
import { useCalendarFeedQuery, useCreateCalendarFeedMutation, useRevokeCalendarFeedMutation } from '@/hooks/use-calendar-feed';
import type { CalendarFeedScopes } from '@/shared/schemas/calendar-feed';
import type { Role } from '@/shared/schemas/session';

/**
 * The person's private calendar feed: an address any calendar application can subscribe to,
 * holding their bookings (and what their role may add). A new address stops the old one at once.
 */
export function CalendarFeedCard({ role }: { role: Role }) {
  const feed = useCalendarFeedQuery();
  const create = useCreateCalendarFeedMutation();
  const revoke = useRevokeCalendarFeedMutation();
  const [scopes, setScopes] = useState<CalendarFeedScopes | null>(null);
  const [copied, setCopied] = useState(false);
  const current = scopes ?? feed.data?.scopes ?? { approvals: false, labBookings: false, inspections: false };
  const url = feed.data?.url ?? null;
  const failure = create.error ?? revoke.error;

  const toggle = (key: keyof CalendarFeedScopes) => (checked: boolean) => setScopes({ ...current, [key]: checked });
  const copy = async () => {
    if (url && typeof navigator !== 'undefined' && navigator.clipboard) {
      await navigator.clipboard.writeText(url).then(
        () => setCopied(true),
        () => setCopied(false),
      );
    }
  };

  return (
    <Card title="Calendar feed" testID="calendar-feed">
      <AppText tone="muted">
        Subscribe to your bookings from the calendar you already use. The address is private: anyone who has it sees what the feed holds.
      </AppText>
      {feed.isPending ? (
        <LoadingState label="Loading your feed" />
      ) : feed.isError ? (
        <ErrorState title="Your feed did not load" error={feed.error} onRetry={() => void feed.refetch()} retrying={feed.isFetching} />
      ) : (
        <>
          {role === 'officer' ? (
            <>
              <Checkbox label="Add the approval queue" checked={current.approvals} onChange={toggle('approvals')} testID="feed-approvals" />
              <Checkbox label="Add every lab booking" checked={current.labBookings} onChange={toggle('labBookings')} testID="feed-lab-bookings" />
            </>
          ) : null}
          {role === 'manager' ? (
            <Checkbox label="Add inspections coming due (12 weeks)" checked={current.inspections} onChange={toggle('inspections')} testID="feed-inspections" />
          ) : null}
          {url ? (
            <View style={styles.url}>
              <AppText variant="label">Your feed address</AppText>
              <AppText selectable testID="calendar-feed-url" style={styles.wrap}>
                {url}
              </AppText>
              <View style={styles.row}>
                <Button
                  label={copied ? 'Copied' : 'Copy the address'}
                  icon="check-circle"
                  variant="secondary"
                  onPress={() => void copy()}
                  testID="calendar-feed-copy"
                />
                <Button
                  label="New address"
                  icon="refresh"
                  variant="secondary"
                  loading={create.isPending}
                  loadingLabel="Making a new address"
                  onPress={() => create.mutate(current)}
                  testID="calendar-feed-rotate"
                />
                <Button
                  label="Turn off"
                  icon="close"
                  variant="secondary"
                  loading={revoke.isPending}
                  loadingLabel="Turning the feed off"
                  onPress={() => revoke.mutate()}
                  testID="calendar-feed-revoke"
                />
              </View>
              <AppText variant="small" tone="muted">
                A new address stops the old one at once; use it if the address was shared by mistake. Changes to the choices above apply with a new address.
              </AppText>
            </View>
          ) : (
            <Button
              label="Turn on my calendar feed"
              icon="calendar-clock"
              loading={create.isPending}
              loadingLabel="Turning the feed on"
              onPress={() => create.mutate(current)}
              testID="calendar-feed-create"
            />
          )}
        </>
      )}
      {failure ? <FormAlert message={describeError(failure)} /> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  url: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  wrap: { flexShrink: 1 },
});
