import { router } from 'expo-router';

import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';
import { useCurrentUser } from '@/hooks/use-session';

/** Unknown addresses, and screens this person's role does not open. */
export function NotFoundScreen() {
  const user = useCurrentUser();
  return (
    <Screen testID="not-found-screen" title="Not found" hideTitle centered>
      <EmptyState
        icon="map-marker-question"
        headingLevel={1}
        title="Nothing here"
        message="This address is not a page in Voltcrib, or it is not open to your role."
        action={
          <Button label={user ? 'Go to Today' : 'Go to sign in'} icon="home-lightning-bolt" onPress={() => router.replace('/')} />
        }
      />
    </Screen>
  );
}
