import { router, type Href } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { ReleaseFailures } from '@/components/release/release-failures';
import { useCancelBookingMutation, useReleaseCheckQuery, type Booking } from '@/hooks/use-bookings';
import { useCurrentUser, useLabTimeZone } from '@/hooks/use-session';
import { GEAR_RULES } from '@/shared/rules/release';
import { OPEN_STATUSES, PRE_RELEASE_STATUSES } from '@/shared/schemas/bookings';
import { zonedTimeWords } from '@/shared/zoned-time';

/** Failures no one at the counter can clear: the booking's gear or window must change first. */
const STANDING_RULES: readonly string[] = [...GEAR_RULES, 'booker'];

interface Step {
  /** What happens next, in a sentence. */
  say: string;
  /** The one primary action, when the next step is the viewer's. */
  action?: { label: string; icon: 'lock-open-variant' | 'keyboard-return' | 'pencil' | 'clipboard-check' | 'calendar-plus'; href: Href; testID: string };
}

const bookAgain = (id: string): Step['action'] => ({
  label: 'Book again',
  icon: 'calendar-plus',
  href: { pathname: '/bookings/new', params: { from: id } },
  testID: 'booking-book-again',
});

function nextStep(booking: Booking, viewer: { id: number; role: string } | null): Step {
  const own = viewer?.id === booking.personId;
  const id = String(booking.id);
  switch (booking.status) {
    case 'requested':
    case 'approved':
      return {
        say:
          booking.status === 'approved'
            ? 'Approved. At the counter: scan each item, complete the pre-energize checklist, release.'
            : 'At the counter: scan each item, complete the pre-energize checklist, release.',
        action: {
          label: 'Go to release',
          icon: 'lock-open-variant',
          href: { pathname: '/bookings/[id]/release', params: { id } },
          testID: 'booking-go-release',
        },
      };
    case 'awaiting-approval':
      if (viewer?.role === 'officer' && !own) {
        return {
          say: 'This test waits for a safety officer. Decide it from the approvals queue.',
          action: { label: 'Open approvals', icon: 'clipboard-check', href: '/approvals', testID: 'booking-go-approvals' },
        };
      }
      return { say: 'Waiting for a safety officer to approve the test plan. You will get an e-mail when they decide.' };
    case 'refused':
      return own
        ? {
            say: 'Refused. Change the plan or the gear as the officer asks; the changed plan goes back for a decision.',
            action: { label: 'Change the plan', icon: 'pencil', href: { pathname: '/bookings/[id]/edit', params: { id } }, testID: 'booking-edit' },
          }
        : { say: 'Refused. The person who booked can change the plan and ask again.' };
    case 'released':
      return {
        say: booking.overdue
          ? 'Overdue: the window has ended. Make the setup safe and return the gear now.'
          : 'Released. When the test is done, make the setup safe and return the gear.',
        action: {
          label: 'Return and make safe',
          icon: 'keyboard-return',
          href: { pathname: '/bookings/[id]/return', params: { id } },
          testID: 'booking-go-return',
        },
      };
    case 'returned':
      return {
        say: `Returned${booking.returnedAt ? ` ${formatDateTime(booking.returnedAt)}` : ''}. Nothing more to do.`,
        action: own ? bookAgain(id) : undefined,
      };
    case 'cancelled':
      return {
        say: `Cancelled${booking.cancelledAt ? ` ${formatDateTime(booking.cancelledAt)}` : ''}. The gear is free for others.`,
        action: own ? bookAgain(id) : undefined,
      };
  }
}

const own = (booking: Booking, viewer: { id: number } | null) => viewer?.id === booking.personId;

/** The next step as the screen's one primary action, with the lesser ones (change, cancel) below. */
export function BookingNextStep({ booking }: { booking: Booking }) {
  const user = useCurrentUser();
  const cancel = useCancelBookingMutation(booking.id);
  const [confirming, setConfirming] = useState(false);
  const zone = useLabTimeZone();
  const check = useReleaseCheckQuery(booking.id, PRE_RELEASE_STATUSES.includes(booking.status));
  const standing = (check.data?.failures ?? []).filter((f) => STANDING_RULES.includes(f.rule));
  const opensAt = check.data && new Date(check.data.opensAt).getTime() > Date.now() ? check.data.opensAt : null;
  const counter = nextStep(booking, user);
  // Never "Go to release" for a booking the gate will refuse whatever is done at the counter.
  const step: Step =
    PRE_RELEASE_STATUSES.includes(booking.status) && standing.length > 0
      ? {
          say: own(booking, user)
            ? 'This booking cannot be released as it stands. Change the gear, window or plan as listed below.'
            : 'This booking cannot be released as it stands; the person who booked must change it.',
        }
      : opensAt && counter.action?.testID === 'booking-go-release'
        ? { ...counter, say: `${counter.say} The counter opens it at ${zonedTimeWords(opensAt, zone)}.` }
        : counter;
  const mine = own(booking, user);
  const staff = user?.role === 'officer' || user?.role === 'manager';
  const canChange = mine && PRE_RELEASE_STATUSES.includes(booking.status);
  const canCancel = (mine || staff) && OPEN_STATUSES.includes(booking.status);

  return (
    <Card title="Next step" testID="booking-next-step">
      {booking.overdue ? <HazardBadge level="warning" detail="Overdue: past the end of its window" testID="booking-overdue" /> : null}
      <AppText variant="bodyStrong" testID="booking-next-step-text">
        {step.say}
      </AppText>
      {standing.length > 0 && PRE_RELEASE_STATUSES.includes(booking.status) ? (
        <ReleaseFailures
          testID="booking-blocked"
          title={`The release will refuse it: ${standing.length} rule${standing.length === 1 ? '' : 's'} the gear fails.`}
          failures={standing}
        />
      ) : null}
      {step.action ? (
        <Button label={step.action.label} icon={step.action.icon} block testID={step.action.testID} onPress={() => router.push(step.action!.href)} />
      ) : null}
      {canChange || canCancel ? (
        <View style={styles.secondary}>
          {canChange ? (
            <Button
              label="Change gear, window or plan"
              icon="pencil"
              variant="secondary"
              testID="booking-edit"
              onPress={() => router.push({ pathname: '/bookings/[id]/edit', params: { id: String(booking.id) } })}
            />
          ) : null}
          {canCancel && !confirming ? (
            <Button label="Cancel booking" icon="cancel" variant="secondary" testID="booking-cancel" onPress={() => setConfirming(true)} />
          ) : null}
        </View>
      ) : null}
      {confirming ? (
        <View style={styles.confirm} testID="booking-cancel-confirm">
          <AppText variant="bodyStrong">Cancel this booking? The gear becomes free for others.</AppText>
          <View style={styles.secondary}>
            <Button
              label="Yes, cancel it"
              variant="danger"
              icon="cancel"
              testID="booking-cancel-yes"
              loading={cancel.isPending}
              loadingLabel="Cancelling"
              onPress={() => cancel.mutate(undefined, { onSuccess: () => setConfirming(false) })}
            />
            <Button label="Keep it" variant="secondary" testID="booking-cancel-no" onPress={() => setConfirming(false)} />
          </View>
        </View>
      ) : null}
      {cancel.isError ? <FormAlert message={describeError(cancel.error)} testID="booking-cancel-error" /> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  secondary: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  confirm: { gap: spacing.sm },
});
