import { LazyReportsScreen } from '@/components/reports/lazy-reports-screen';

export default function ReportsRoute() {
  return <LazyReportsScreen />;
}
