import { router } from 'expo-router';

import { roleLabels } from '@/components/common/roles';
import { areaAudience, canEnter, type Area } from '@/components/navigation/nav-model';

import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';
import { useCurrentUser } from '@/hooks/use-session';

/**
 * Unknown addresses, and (with `closedArea`, from RoleGate) screens this person's role does not
 * open: those say whom the page is for. The group's URL is not always the one typed (the router
 * settles on the group's first screen), so the words name the audience, not the page.
 */
export function NotFoundScreen({ closedArea }: { closedArea?: Area }) {
  const user = useCurrentUser();
  const closed = user && closedArea && !canEnter(closedArea, user.role) ? closedArea : undefined;
  return (
    <Screen testID="not-found-screen" title={closed ? 'Not open to your role' : 'Not found'} hideTitle centered>
      <EmptyState
        icon="map-marker-question"
        headingLevel={1}
        testID={closed ? 'not-found-role' : 'not-found-nothing'}
        title={closed ? `This page is for ${areaAudience[closed]}` : 'Nothing here'}
        message={
          closed
            ? `You are signed in as a ${roleLabels[user!.role].toLowerCase()}, so it is not open to you. Ask the lab manager if your work needs it.`
            : 'This address is not a page in Voltcrib. Check the link, or go on from Today.'
        }
        action={<Button label={user ? 'Go to Today' : 'Go to sign in'} icon="home-lightning-bolt" onPress={() => router.replace('/')} />}
      />
    </Screen>
  );
}
