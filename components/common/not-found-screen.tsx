import { router, usePathname } from 'expo-router';

import { roleLabels } from '@/components/common/roles';
import { areaAudience, canEnter, restrictedEntryFor } from '@/components/navigation/nav-model';

import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';
import { useCurrentUser } from '@/hooks/use-session';

/** Unknown addresses, and screens this person's role does not open. */
export function NotFoundScreen() {
  const user = useCurrentUser();
  const pathname = usePathname();
  // A real screen the person's role does not open: say so, rather than "nothing here".
  const restricted = restrictedEntryFor(pathname);
  const closed = user && restricted && !canEnter(restricted.area, user.role) ? restricted : undefined;
  return (
    <Screen testID="not-found-screen" title={closed ? `${closed.label}: not open to you` : 'Not found'} hideTitle centered>
      <EmptyState
        icon="map-marker-question"
        headingLevel={1}
        testID={closed ? 'not-found-role' : 'not-found-nothing'}
        title={closed ? `${closed.label} is for ${areaAudience[closed.area]}` : 'Nothing here'}
        message={
          closed
            ? `You are signed in as a ${roleLabels[user!.role].toLowerCase()}, so this page is not open to you. Ask the lab manager if your work needs it.`
            : 'This address is not a page in Voltcrib. Check the link, or go on from Today.'
        }
        action={
          <Button label={user ? 'Go to Today' : 'Go to sign in'} icon="home-lightning-bolt" onPress={() => router.replace('/')} />
        }
      />
    </Screen>
  );
}
