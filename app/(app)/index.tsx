import { TodayScreen } from '@/components/today/today-screen';

export default function TodayRoute() {
  return <TodayScreen />;
}
