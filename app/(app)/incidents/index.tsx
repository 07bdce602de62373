import { LazyIncidentsScreen } from '@/components/incidents/lazy-screens';

export default function IncidentsRoute() {
  return <LazyIncidentsScreen />;
}
