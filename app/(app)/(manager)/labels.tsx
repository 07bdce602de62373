import { LabelsScreen } from '@/components/labels/labels-screen';

export default function LabelsRoute() {
  return <LabelsScreen />;
}
