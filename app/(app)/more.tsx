import { MoreScreen } from '@/components/more/more-screen';

export default function MoreRoute() {
  return <MoreScreen />;
}
