import { Stack } from 'expo-router';

// Incidents' own stack: list → report → one incident, so going back stays here.
export const unstable_settings = { initialRouteName: 'index' };

export default function IncidentsLayout() {
  return <Stack screenOptions={{ headerShown: false }} />;
}
