import { router, useIsFocused } from 'expo-router';
import { useEffect, useState } from 'react';

import { AppText } from '@/components/ui/app-text';
import { FormAlert } from '@/components/ui/form-alert';
import { LoadingState } from '@/components/ui/loading-state';
import { Screen } from '@/components/ui/screen';
import { describeError } from '@/components/ui/error-state';
import { isApiError } from '@/hooks/api-client';
import { useItemByTagQuery } from '@/hooks/use-items';
import { ERROR_CODES } from '@/shared/errors';

import { QrScanner } from './qr-scanner';

/** Scan a gear label (or type its tag) and open the item's page. */
export function ScanScreen() {
  // Tabs keep this screen mounted; only a focused Scan may hold the camera (and its light).
  const focused = useIsFocused();
  const [tag, setTag] = useState<string | null>(null);
  const lookup = useItemByTagQuery(tag);

  // Coming back to Scan starts afresh: no stale "not found" from the last visit.
  useEffect(() => {
    if (!focused) setTag(null);
  }, [focused]);

  useEffect(() => {
    if (lookup.data && tag !== null) {
      setTag(null);
      router.push({ pathname: '/gear/[id]', params: { id: String(lookup.data.id) } });
    }
  }, [lookup.data, tag]);

  const notFound = isApiError(lookup.error) && lookup.error.code === ERROR_CODES.notFound;
  const looking = tag !== null && lookup.isFetching;

  return (
    <Screen testID="scan-screen" title="Scan">
      <AppText tone="muted">Point the camera at the QR label on a piece of gear to open its page.</AppText>
      {focused ? <QrScanner onTag={setTag} paused={looking} testID="scan" /> : null}
      {looking ? <LoadingState label={`Looking up ${tag}`} testID="scan-looking" /> : null}
      {!looking && tag !== null && lookup.isError ? (
        <FormAlert
          testID={notFound ? 'scan-not-found' : 'scan-error'}
          message={notFound ? `No gear carries the tag ${tag}. Check the label, or find the item under Gear.` : describeError(lookup.error)}
        />
      ) : null}
    </Screen>
  );
}
