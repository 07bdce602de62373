import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function PlannerScreen() {
  return (
    <PlaceholderScreen
      testID="planner-screen"
      title="Planner"
      icon="calculator-variant"
      comingWith="The setup calculations (stored energy, bleed-down time, rating margins) arrive with the planner work."
    />
  );
}
