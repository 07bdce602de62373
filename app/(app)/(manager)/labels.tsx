import { LazyLabelsScreen } from '@/components/labels/lazy-labels-screen';

export default function LabelsRoute() {
  return <LazyLabelsScreen />;
}
