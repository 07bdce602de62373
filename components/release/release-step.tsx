import { useEffect } from 'react';
import { View } from 'react-native';

import { formatWindow } from '@/components/bookings/booking-time';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { LoadingState } from '@/components/ui/loading-state';
import { isGateRefusedError, useReleaseCheckQuery, useReleaseMutation, type Booking } from '@/hooks/use-bookings';

import { ReleaseFailures } from './release-failures';
import { StepCard, type StepState } from './step-card';

/**
 * Step 3: release. Before the button, what the release rules say now (the same rules the server
 * runs when the button is pressed), so nobody learns of a refusal only at the last step; the
 * server still checks every rule again under its locks and names each one that fails.
 */
export function ReleaseStep({ booking, state }: { booking: Booking; state: StepState }) {
  const release = useReleaseMutation(booking.id);
  const check = useReleaseCheckQuery(booking.id);
  const refusal = isGateRefusedError(release.error) ? release.error : null;
  const failures = check.data?.failures ?? [];
  // A refusal answers the booking as it was when pressed: once the checklist is answered again
  // (or a scan lands), it no longer describes anything, and the check above says what holds now.
  const runKey = `${booking.checklistRuns.pre?.completedAt ?? ''}|${booking.scannedItemIds.length}`;
  const { reset } = release;
  useEffect(() => reset(), [runKey, reset]);

  return (
    <StepCard number={3} title="Release" state={state} testID="release-step-release">
      <AppText>{`The release rules are checked again when you press the button: approval, window (${formatWindow(booking.startsAt, booking.endsAt)}), scans, service and inspection, ratings, companions, checklist and qualification.`}</AppText>
      {check.isPending ? (
        <LoadingState label="Checking the release rules" />
      ) : check.isError ? (
        <FormAlert message={`The release rules could not be checked: ${describeError(check.error)}`} testID="release-check-error" />
      ) : refusal ? null : failures.length > 0 ? (
        <ReleaseFailures
          testID="release-check"
          title={`Not yet: ${failures.length} rule${failures.length === 1 ? '' : 's'} still in the way.`}
          failures={failures}
        />
      ) : (
        <Badge label="Every release rule holds now" icon="check-circle" tone="primary" testID="release-check-clear" />
      )}
      {refusal ? (
        <ReleaseFailures
          testID="release-failures"
          title={refusal.failures.length > 0 ? refusal.message : `${refusal.message} Reload the booking to see what changed.`}
          failures={refusal.failures}
        />
      ) : release.error ? (
        <FormAlert message={describeError(release.error)} testID="release-error" />
      ) : null}
      <View>
        <Button
          label="Release the gear"
          icon="lock-open-variant"
          variant={state === 'current' && failures.length === 0 ? 'primary' : 'secondary'}
          block
          disabled={check.isPending || failures.length > 0}
          loading={release.isPending}
          loadingLabel="Checking the rules"
          testID="release-submit"
          onPress={() => release.mutate()}
        />
      </View>
    </StepCard>
  );
}
