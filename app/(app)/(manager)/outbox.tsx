import { OutboxScreen } from '@/components/outbox/outbox-screen';

export default function OutboxRoute() {
  return <OutboxScreen />;
}
