import { LazyAuditScreen as AuditScreen } from '@/components/bookings/lazy-screens';

export default function AuditRoute() {
  return <AuditScreen />;
}
