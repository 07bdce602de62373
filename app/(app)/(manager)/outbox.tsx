import { useLocalSearchParams } from 'expo-router';

import { LazyOutboxScreen } from '@/components/outbox/lazy-outbox-screen';

export default function OutboxRoute() {
  const { message } = useLocalSearchParams<{ message?: string }>();
  return <LazyOutboxScreen messageId={message} />;
}
