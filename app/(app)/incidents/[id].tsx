import { useLocalSearchParams } from 'expo-router';

import { LazyIncidentScreen } from '@/components/incidents/lazy-screens';

export default function IncidentRoute() {
  const { id, sent } = useLocalSearchParams<{ id: string; sent?: string }>();
  return <LazyIncidentScreen id={Number(id)} sent={sent === '1'} />;
}
