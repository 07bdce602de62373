import { router } from 'expo-router';
import { View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { isApiError } from '@/hooks/api-client';
import { useMailboxQuery } from '@/hooks/use-mailbox';

import { MessageView } from './message-view';

interface OutboxScreenProps {
  /** The `message` search parameter: the message open, so the back button returns to the list. */
  messageId?: string;
}

/** Every e-mail the local mail server received, newest first: invitations, resets, reminders. */
export function OutboxScreen({ messageId }: OutboxScreenProps) {
  const mailbox = useMailboxQuery();
  const open = (id: number | undefined) => router.setParams({ message: id === undefined ? undefined : String(id) });
  const selected = messageId ? mailbox.data?.find((m) => String(m.id) === messageId) : undefined;

  if (selected) {
    return (
      <Screen testID="outbox-screen" title="Outbox">
        <View>
          <Button label="All messages" icon="email-fast" variant="secondary" testID="outbox-back" onPress={() => open(undefined)} />
        </View>
        <MessageView message={selected} />
      </Screen>
    );
  }

  // 404 is not a failure: this server hands mail to a real SMTP server and keeps no local copy.
  const noLocalMailbox = mailbox.isError && isApiError(mailbox.error) && mailbox.error.status === 404;

  return (
    <Screen testID="outbox-screen" title="Outbox">
      <AppText tone="muted">
        The e-mails Voltcrib sent through the lab&apos;s local mail server, newest first. Use it to pass on an invitation or a reset link by hand.
      </AppText>
      {mailbox.isPending ? (
        <LoadingState label="Loading messages" testID="outbox-loading" />
      ) : noLocalMailbox ? (
        <EmptyState
          testID="outbox-no-mailbox"
          icon="email-fast"
          title="No local mailbox"
          message="This Voltcrib sends its e-mail to the lab's real mail (SMTP) server, so there is no local copy to show here. Ask the recipients to check their inbox."
        />
      ) : mailbox.isError ? (
        <ErrorState
          testID="outbox-error"
          title="The messages did not load"
          error={mailbox.error}
          onRetry={() => void mailbox.refetch()}
          retrying={mailbox.isRefetching}
        />
      ) : mailbox.data.length === 0 ? (
        <EmptyState
          testID="outbox-empty"
          icon="tray"
          title="No e-mail yet"
          message="Invitations, password resets, approval requests and reminders appear here once they are sent."
        />
      ) : (
        <>
          {messageId ? (
            <AppText tone="muted" testID="outbox-not-found">
              That message is no longer in the local mailbox (it keeps messages only while the server runs).
            </AppText>
          ) : null}
          <Card flush testID="outbox-list">
            {mailbox.data.map((message, index) => (
              <ListRow
                key={message.id}
                testID={`outbox-message-${message.id}`}
                icon="email-fast"
                title={message.subject || '(no subject)'}
                subtitle={`To ${message.to}\n${formatDateTime(message.receivedAt)}`}
                onPress={() => open(message.id)}
                divided={index > 0}
              />
            ))}
          </Card>
        </>
      )}
    </Screen>
  );
}
