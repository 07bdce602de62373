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

const timeFormat = new Intl.DateTimeFormat(undefined, { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

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
  const opensAt = check.data ? new Date(check.data.opensAt) : null;
  const notYet = opensAt !== null && opensAt.getTime() > Date.now();

  return (
    <StepCard number={3} title="Release" state={state} testID="release-step-release">
      {notYet && opensAt ? <Badge label={`Opens ${timeFormat.format(opensAt)}`} icon="timer-sand" tone="primary" testID="release-opens-at" /> : null}
      <AppText>{`The release rules are checked again when you press the button: approval, window (${formatWindow(booking.startsAt, booking.endsAt)}), scans, service and inspection, ratings, companions, checklist and qualification.`}</AppText>
      {check.isPending ? (
        <LoadingState label="Checking the release rules" />
      ) : check.isError ? (
        <FormAlert message={`The release rules could not be checked: ${describeError(check.error)}`} testID="release-check-error" />
      ) : refusal ? null : failures.length > 0 ? (
        <ReleaseFailures testID="release-check" title={`Not yet: ${failures.length} rule${failures.length === 1 ? '' : 's'} still in the way.`} failures={failures} />
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
