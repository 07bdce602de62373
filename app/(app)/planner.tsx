import { useLocalSearchParams } from 'expo-router';

import { PlannerScreen } from '@/components/planner/planner-screen';

export default function PlannerRoute() {
  const { tab } = useLocalSearchParams<{ tab?: string }>();
  return <PlannerScreen tab={tab} />;
}
