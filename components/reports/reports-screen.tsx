import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function ReportsScreen() {
  return (
    <PlaceholderScreen
      testID="reports-screen"
      title="Reports"
      icon="chart-bar"
      comingWith="Use per group, overdue gear and inspections due arrive with the reports work."
    />
  );
}
