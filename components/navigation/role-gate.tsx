import type { ReactNode } from 'react';

import { NotFoundScreen } from '@/components/common/not-found-screen';
import { useCurrentUser } from '@/hooks/use-session';

import { canEnter, type Area } from './nav-model';

/**
 * A role group's layout renders its screens only for the roles `canEnter` admits; anyone else
 * is told the page is for another role (not sent to Today without a word). The server refuses
 * the group's API calls to them in any case.
 */
export function RoleGate({ area, children }: { area: Area; children: ReactNode }) {
  const role = useCurrentUser()?.role;
  return canEnter(area, role) ? children : <NotFoundScreen closedArea={area} />;
}
