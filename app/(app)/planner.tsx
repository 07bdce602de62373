import { PlannerScreen } from '@/components/planner/planner-screen';

export default function PlannerRoute() {
  return <PlannerScreen />;
}
