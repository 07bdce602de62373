import { LazyLabRulesScreen as LabRulesScreen } from '@/components/bookings/lazy-screens';

export default function LabRulesRoute() {
  return <LabRulesScreen />;
}
