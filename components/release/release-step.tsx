import { View } from 'react-native';

import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { isGateRefusedError, useReleaseMutation, type Booking } from '@/hooks/use-bookings';

import { ReleaseFailures } from './release-failures';
import { StepCard, type StepState } from './step-card';

/** Step 3: ask the server to release. It checks every rule again and names each one that fails. */
export function ReleaseStep({ booking, state }: { booking: Booking; state: StepState }) {
  const release = useReleaseMutation(booking.id);
  const awaiting = booking.approvalRequired && !(booking.approval?.current && booking.approval.decision === 'approve');
  const refusal = isGateRefusedError(release.error) ? release.error : null;

  return (
    <StepCard number={3} title="Release" state={state} testID="release-step-release">
      {awaiting ? (
        <Badge label="Needs an officer's approval first" icon="timer-sand" tone="primary" testID="release-awaiting-approval" />
      ) : null}
      <AppText>The server checks every release rule again now: approval, window, scans, service and inspection, ratings, companions, checklist and qualification.</AppText>
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
          variant={state === 'current' ? 'primary' : 'secondary'}
          block
          loading={release.isPending}
          loadingLabel="Checking the rules"
          testID="release-submit"
          onPress={() => release.mutate()}
        />
      </View>
    </StepCard>
  );
}

