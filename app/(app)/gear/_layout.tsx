import { Stack } from 'expo-router';

// The list sits under an item page even when the item was opened straight from Scan or a label,
// so "back" from an item lands on the gear list.
export const unstable_settings = { initialRouteName: 'index' };

export default function GearLayout() {
  return (
    <Stack screenOptions={{ headerShown: false }}>
      {/* One list and one page per item in the stack, however often the Gear tab or a scan opens them. */}
      <Stack.Screen name="index" dangerouslySingular />
      <Stack.Screen name="[id]/index" dangerouslySingular />
    </Stack>
  );
}
