import { Redirect, router } from 'expo-router';

import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { isApiError } from '@/hooks/api-client';
import { useItemByTagQuery } from '@/hooks/use-items';
import { useCurrentUser } from '@/hooks/use-session';
import { ERROR_CODES } from '@/shared/errors';

interface ItemByTagScreenProps {
  tag: string;
}

/**
 * Where a QR label opened by any phone camera lands. Signed-out visitors sign in and return here;
 * signed-in ones are sent on to the item's own page inside the app (with its navigation).
 */
export function ItemByTagScreen({ tag }: ItemByTagScreenProps) {
  const user = useCurrentUser();
  const lookup = useItemByTagQuery(user ? tag : null);

  if (!user) {
    return <Redirect href={{ pathname: '/sign-in', params: { next: `/i/${encodeURIComponent(tag)}` } }} />;
  }
  if (lookup.data) {
    return <Redirect href={{ pathname: '/gear/[id]', params: { id: String(lookup.data.id) } }} />;
  }

  // A malformed tag is refused by the server's tag rule (400): to the person, it is the same
  // "no such label" as an unknown one.
  const unknown = isApiError(lookup.error) && (lookup.error.code === ERROR_CODES.notFound || lookup.error.code === ERROR_CODES.validation);

  return (
    <Screen testID="item-by-tag-screen" title="Scanned label" centered={unknown}>
      {lookup.isError ? (
        unknown ? (
          <EmptyState
            testID="item-by-tag-not-found"
            icon="map-marker-question"
            title={`No gear carries the tag ${tag}`}
            message="The label may be misprinted or from another lab. Tell the lab manager, and do not use the item until it is identified."
            action={<Button label="Scan another label" icon="qrcode-scan" onPress={() => router.replace('/scan')} />}
          />
        ) : (
          <ErrorState
            testID="item-by-tag-error"
            title="The label could not be looked up"
            error={lookup.error}
            onRetry={() => void lookup.refetch()}
            retrying={lookup.isRefetching}
          />
        )
      ) : (
        <LoadingState label={`Opening ${tag}`} testID="item-by-tag-loading" />
      )}
    </Screen>
  );
}
