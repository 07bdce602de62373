import { PlaceholderScreen } from '@/components/common/placeholder-screen';

export function GearScreen() {
  return (
    <PlaceholderScreen
      testID="gear-screen"
      title="Gear"
      icon="tools"
      comingWith="The gear registry, with each item's ratings, history and label, arrives with the registry work."
    />
  );
}
