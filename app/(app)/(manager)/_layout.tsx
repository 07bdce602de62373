import { Stack } from 'expo-router';

import { RoleGate } from '@/components/navigation/role-gate';

// Who may open this group: the 'manager' area of components/navigation/nav-model.ts.
export default function GroupLayout() {
  return (
    <RoleGate area="manager">
      <Stack screenOptions={{ headerShown: false }} />
    </RoleGate>
  );
}
