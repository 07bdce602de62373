import { GearScreen } from '@/components/gear/gear-screen';

export default function GearRoute() {
  return <GearScreen />;
}
