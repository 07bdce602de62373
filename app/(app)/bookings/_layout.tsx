import { Stack } from 'expo-router';

// The Bookings tab's own stack: list → booking → release / return, so going back stays in the tab.
export const unstable_settings = { initialRouteName: 'index' };

export default function BookingsLayout() {
  return <Stack screenOptions={{ headerShown: false }} />;
}
