import { useBreakpoints } from '@/hooks/use-breakpoints';

import { SideNav } from './side-nav';
import { TabBar } from './tab-bar';

/** The signed-in app's navigation: a bottom bar on a phone, a side column on a wide screen. */
export function AppNavigation() {
  const { isWide } = useBreakpoints();
  return isWide ? <SideNav /> : <TabBar />;
}
