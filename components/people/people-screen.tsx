import { router } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { usePeopleQuery } from '@/hooks/use-people';
import { useCurrentUser } from '@/hooks/use-session';

import { InviteForm } from './invite-form';
import { InviteSent } from './invite-sent';
import { PeopleList, PeopleTable } from './people-list';
import { PersonPanel } from './person-panel';
import { localToday } from './qualification';

interface PeopleScreenProps {
  /** The `person` search parameter: the person being looked at, so the back button returns to the list. */
  personId?: string;
}

export function PeopleScreen({ personId }: PeopleScreenProps) {
  const people = usePeopleQuery();
  const me = useCurrentUser();
  const { isWide } = useBreakpoints();
  const [inviting, setInviting] = useState(false);
  const [sent, setSent] = useState<{ name: string; email: string } | null>(null);
  const today = localToday();
  const selected = personId ? people.data?.find((p) => String(p.id) === personId) : undefined;

  const open = (id: number | undefined) => router.setParams({ person: id === undefined ? undefined : String(id) });

  if (personId && people.isSuccess && selected) {
    return (
      <Screen testID="people-screen" title="People" width="regular">
        <View>
          <Button label="All people" icon="account-group" variant="secondary" testID="person-back" onPress={() => open(undefined)} />
        </View>
        <PersonPanel person={selected} isSelf={me?.id === selected.id} today={today} />
      </Screen>
    );
  }

  return (
    <Screen testID="people-screen" title="People" width={isWide ? 'wide' : 'regular'}>
      <AppText tone="muted">Everyone who can sign in to this lab&apos;s Voltcrib, and what they may do.</AppText>
      {sent ? <InviteSent person={sent} onDismiss={() => setSent(null)} /> : null}
      {inviting ? (
        <InviteForm
          onSent={(person) => {
            setInviting(false);
            setSent(person);
          }}
          onCancel={() => setInviting(false)}
        />
      ) : (
        <View style={styles.action}>
          <Button
            label="Invite a person"
            icon="account"
            testID="people-invite-open"
            block={!isWide}
            onPress={() => {
              setSent(null);
              setInviting(true);
            }}
          />
        </View>
      )}
      {personId && people.isSuccess && !selected ? (
        <AppText tone="muted" testID="people-not-found">
          That person is not in this lab&apos;s list; pick someone below.
        </AppText>
      ) : null}
      {people.isPending ? (
        <LoadingState label="Loading people" testID="people-loading" />
      ) : people.isError ? (
        <ErrorState
          testID="people-error"
          title="The people list did not load"
          error={people.error}
          onRetry={() => void people.refetch()}
          retrying={people.isRefetching}
        />
      ) : people.data.length === 0 ? (
        <EmptyState testID="people-empty" icon="account-group" title="No one here yet" message="Invite the first person with the button above." />
      ) : isWide ? (
        <PeopleTable people={people.data} today={today} onOpen={(p) => open(p.id)} />
      ) : (
        <PeopleList people={people.data} today={today} onOpen={(p) => open(p.id)} />
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  action: { gap: spacing.xs },
});
