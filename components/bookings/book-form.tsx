import { zodResolver } from '@hookform/resolvers/zod';
import { router } from 'expo-router';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormAlert } from '@/components/ui/form-alert';
import { FormTextField } from '@/components/ui/form-fields';
import { useLiveAssessment } from '@/hooks/use-assessment';
import { useGearAvailability, useGearItems } from '@/hooks/use-booking-gear';
import { useCreateBookingMutation, useUpdateBookingMutation, type Booking } from '@/hooks/use-bookings';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useCurrentUser } from '@/hooks/use-session';
import { gearFailures } from '@/shared/rules/release';
import { bookingCreateSchema } from '@/shared/schemas/bookings';
import { GateSummary } from '@/components/assessment/gate-summary';

import { BOOK_FIELDS, bookingDefaults, copiedDefaults, newBookingDefaults, type BookFormValues } from './book-form-values';
import { ItemPicker } from './item-picker';
import { COMPANION_KINDS, SuitableItems } from './suitable-items';
import { LiveAssessmentView } from './live-assessment';
import { PlanFields } from './plan-fields';
import { applyServerErrors } from './server-errors';
import { WindowFields } from './window-fields';

interface BookFormProps {
  /** Present when changing a booking: the form starts from it and saves with PATCH. */
  booking?: Booking;
  /** A new booking copied from this one (gear, place, purpose, plan), in a new window. */
  copyOf?: Booking;
  /** A new booking starting with these items. */
  itemIds?: number[];
}

/** Gear, window, place, purpose and test plan, with the setup assessment worked out as they change. */
export function BookForm({ booking, copyOf, itemIds: startItems }: BookFormProps) {
  const user = useCurrentUser();
  const { isWide } = useBreakpoints();
  const create = useCreateBookingMutation();
  const update = useUpdateBookingMutation(booking?.id ?? 0);
  const {
    control,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<BookFormValues>({
    resolver: zodResolver(bookingCreateSchema),
    defaultValues: booking ? bookingDefaults(booking) : copyOf ? copiedDefaults(copyOf) : { ...newBookingDefaults(), itemIds: startItems ?? [] },
  });

  const values = useWatch({ control });
  const itemIds = (values.itemIds ?? []).filter((id): id is number => typeof id === 'number');
  const gear = useGearItems(itemIds);
  const live = useLiveAssessment({ items: gear.items, itemsLoading: gear.loading, plan: values.plan, personId: user?.id });
  const window = values.startsAt && values.endsAt && new Date(values.endsAt) > new Date(values.startsAt) ? { from: values.startsAt, to: values.endsAt } : null;

  // The same gear rules the release enforces (shared/rules/release.ts), with the window's clashes,
  // so a set that can never be released says why before it is requested.
  const availability = useGearAvailability(itemIds, window);
  const clashingTags = window
    ? itemIds
        .filter((id) => (availability[id]?.busy ?? []).some((slot) => slot.bookingId !== booking?.id))
        .map((id) => gear.items.find((i) => i.id === id)?.tag ?? `item ${id}`)
    : [];
  const blockers = live.state === 'ready' ? gearFailures(live.assessment, clashingTags) : [];

  const onSubmit = handleSubmit(async (input) => {
    try {
      const body = bookingCreateSchema.parse(input);
      const saved = booking ? await update.mutateAsync(body) : await create.mutateAsync(body);
      router.replace({ pathname: '/bookings/[id]', params: { id: String(saved.id) } });
    } catch (error) {
      applyServerErrors(error, BOOK_FIELDS, setError);
    }
  });

  const form = (
    <View style={styles.column}>
      <Card title="Gear">
        <Controller
          control={control}
          name="itemIds"
          render={({ field }) => (
            <ItemPicker
              value={field.value ?? []}
              onChange={field.onChange}
              picked={gear.items}
              window={window}
              ownBookingId={booking?.id}
              error={errors.itemIds?.message ?? errors.itemIds?.root?.message}
            />
          )}
        />
      </Card>
      <Card title="When and where">
        <Controller
          control={control}
          name="startsAt"
          render={({ field: start }) => (
            <Controller
              control={control}
              name="endsAt"
              render={({ field: end }) => (
                <WindowFields
                  startsAt={start.value ?? ''}
                  endsAt={end.value ?? ''}
                  onStartsAt={start.onChange}
                  onEndsAt={end.onChange}
                  startsAtError={errors.startsAt?.message}
                  endsAtError={errors.endsAt?.message}
                />
              )}
            />
          )}
        />
        <FormTextField
          control={control}
          name="location"
          label="Bench or bay"
          hint="Where the test will run, e.g. Bay 1 (interlocked cage)"
          testID="book-location"
        />
        <FormTextField
          control={control}
          name="purpose"
          label="Purpose"
          hint="What the test is for; the safety officer reads it."
          multiline
          testID="book-purpose"
        />
      </Card>
      <Card title="Test plan">
        <PlanFields control={control} errors={errors} />
      </Card>
    </View>
  );

  const approvalLine =
    live.state === 'ready'
      ? live.assessment.approvalRequired
        ? `A safety officer must approve this test (${live.assessment.approvalReasons.length} reason${live.assessment.approvalReasons.length === 1 ? '' : 's'} in the assessment).`
        : 'No officer approval needed by the live assessment.'
      : null;

  const submit = (
    <View style={styles.submit}>
      {live.state === 'ready' ? (
        <GateSummary
          failures={blockers}
          clashesChecked={window !== null}
          testID="book-gate"
          actionFor={(failure) => {
            const kind = COMPANION_KINDS[failure.rule];
            if (!kind) return null;
            return (
              <SuitableItems
                kind={kind}
                minKv={live.assessment.requiredKv}
                picked={itemIds}
                onAdd={(id) => setValue('itemIds', [...itemIds, id], { shouldValidate: true })}
                testID={`book-suitable-${failure.rule}`}
              />
            );
          }}
        />
      ) : null}
      {approvalLine ? (
        <AppText variant="bodyStrong" testID="book-approval-line">
          {approvalLine}
        </AppText>
      ) : null}
      {errors.root?.server?.message ? <FormAlert testID="book-error" message={errors.root.server.message} /> : null}
      <Button
        label={booking ? 'Save changes' : 'Request booking'}
        loadingLabel={booking ? 'Saving' : 'Booking'}
        icon={booking ? 'pencil' : 'calendar-plus'}
        block
        loading={isSubmitting}
        testID="book-submit"
        onPress={() => void onSubmit()}
      />
      {booking?.approval?.current ? (
        <AppText variant="small" tone="muted">
          Changing the gear, window or plan voids the officer&apos;s approval; the new plan needs a new decision.
        </AppText>
      ) : null}
    </View>
  );

  if (isWide) {
    return (
      <View style={styles.wide}>
        <View style={styles.wideColumn}>
          {form}
          {submit}
        </View>
        <View style={styles.wideColumn}>
          <LiveAssessmentView live={live} />
        </View>
      </View>
    );
  }
  return (
    <View style={styles.column}>
      {form}
      {/* On a phone the submit sits right after the verdict and cautions, not five screens down. */}
      <LiveAssessmentView live={live} afterSummary={submit} />
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  wide: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-start' },
  wideColumn: { flex: 1, gap: spacing.lg },
  submit: { gap: spacing.sm },
});
