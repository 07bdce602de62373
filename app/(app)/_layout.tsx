import { Tabs } from 'expo-router/js-tabs';

import { AppNavigation } from '@/components/navigation/app-navigation';
import { canEnter } from '@/components/navigation/nav-model';
import { useTheme } from '@/components/theme/use-theme';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useCurrentUser } from '@/hooks/use-session';

// The signed-in app. Role groups are guarded here, from the same table the menus read, so a
// screen a role may not open is not in the navigator at all: its URL shows not-found.
export default function AppLayout() {
  const role = useCurrentUser()?.role;
  const { isWide } = useBreakpoints();
  const { colors } = useTheme();

  return (
    <Tabs
      tabBar={() => <AppNavigation />}
      backBehavior="history"
      screenOptions={{
        headerShown: false,
        tabBarPosition: isWide ? 'left' : 'bottom',
        sceneStyle: { backgroundColor: colors.background },
      }}
    >
      <Tabs.Screen name="index" />
      <Tabs.Screen name="gear" />
      <Tabs.Screen name="scan" />
      <Tabs.Screen name="bookings" />
      <Tabs.Screen name="more" />
      <Tabs.Screen name="planner" />
      <Tabs.Protected guard={canEnter('officer', role)}>
        <Tabs.Screen name="(officer)" />
      </Tabs.Protected>
      <Tabs.Protected guard={canEnter('manager', role)}>
        <Tabs.Screen name="(manager)" />
      </Tabs.Protected>
      <Tabs.Protected guard={canEnter('staff', role)}>
        <Tabs.Screen name="(staff)" />
      </Tabs.Protected>
    </Tabs>
  );
}
