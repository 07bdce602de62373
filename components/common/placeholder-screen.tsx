import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';
import type { IconName } from '@/components/ui/icon';

interface PlaceholderScreenProps {
  testID: string;
  title: string;
  icon: IconName;
  /** One plain sentence: which later work fills this screen. */
  comingWith: string;
}

/** A screen whose route and guard exist but whose content a later piece of work brings. */
export function PlaceholderScreen({ testID, title, icon, comingWith }: PlaceholderScreenProps) {
  return (
    <Screen testID={testID} title={title}>
      <EmptyState icon={icon} title="Not here yet" message={comingWith} />
    </Screen>
  );
}
