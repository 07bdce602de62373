import { Tabs } from 'expo-router/js-tabs';

import { AppNavigation } from '@/components/navigation/app-navigation';
import { useTheme } from '@/components/theme/use-theme';
import { useBreakpoints } from '@/hooks/use-breakpoints';

// The signed-in app. Role groups are guarded in their own layouts (RoleGate), from the same
// table the menus read.
export default function AppLayout() {
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
      <Tabs.Screen name="incidents" />
      {/* Role groups guard themselves (RoleGate in each group's layout), so a URL outside the
          person's role says whom the page is for instead of landing silently on Today. */}
      <Tabs.Screen name="(officer)" />
      <Tabs.Screen name="(manager)" />
      <Tabs.Screen name="(staff)" />
    </Tabs>
  );
}
