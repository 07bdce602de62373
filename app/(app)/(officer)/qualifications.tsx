import { LazyQualificationsScreen as QualificationsScreen } from '@/components/bookings/lazy-screens';

export default function QualificationsRoute() {
  return <QualificationsScreen />;
}
