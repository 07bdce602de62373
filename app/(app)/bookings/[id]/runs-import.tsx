import { useLocalSearchParams } from 'expo-router';

import { LazyBenchImportScreen as BenchImportScreen } from '@/components/bench-log/lazy-screens';

export default function BenchImportRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <BenchImportScreen id={Number(id)} />;
}
