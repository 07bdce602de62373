import { LazyGearScreen } from '@/components/gear/lazy-gear-screen';

export default function GearRoute() {
  return <LazyGearScreen />;
}
