import { useLocalSearchParams } from 'expo-router';

import { LazyBenchLogScreen as BenchLogScreen } from '@/components/bench-log/lazy-screens';

export default function BenchLogRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <BenchLogScreen id={Number(id)} />;
}
