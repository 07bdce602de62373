import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function LabelsScreen() {
  return (
    <PlaceholderScreen
      testID="labels-screen"
      title="Labels"
      icon="label-multiple"
      comingWith="Printable sheets of QR labels arrive with the labels work."
    />
  );
}
