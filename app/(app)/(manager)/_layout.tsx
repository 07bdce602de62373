import { Stack } from 'expo-router';

// Access to this group is decided in app/(app)/_layout.tsx (see components/navigation/nav-model.ts).
export default function GroupLayout() {
  return <Stack screenOptions={{ headerShown: false }} />;
}
