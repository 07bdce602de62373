// The bench log's screens load on first use, like the booking screens (lazy-screens.ts there):
// the first screen's bundle budget holds, and the charts load later still (bench-log-screen.tsx).
import { lazyScreen } from '@/components/common/lazy-screen';

export const LazyBenchLogScreen = lazyScreen(() => import('./bench-log-screen').then((m) => m.BenchLogScreen), {
  title: 'Bench log',
  label: 'Loading the bench log',
});
export const LazyBenchImportScreen = lazyScreen(() => import('./import-screen').then((m) => m.BenchImportScreen), {
  title: 'Import runs',
  label: 'Loading the import',
});
