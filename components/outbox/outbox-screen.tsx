import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function OutboxScreen() {
  return (
    <PlaceholderScreen
      testID="outbox-screen"
      title="Outbox"
      icon="email-fast"
      comingWith="The list of every e-mail Voltcrib sends, and its state, arrives with the mail work."
    />
  );
}
