import { LazyApprovalsScreen as ApprovalsScreen } from '@/components/bookings/lazy-screens';

export default function ApprovalsRoute() {
  return <ApprovalsScreen />;
}
