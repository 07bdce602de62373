import { zodResolver } from '@hookform/resolvers/zod';
import { router } from 'expo-router';
import { useEffect, useRef, useState } from 'react';
import { Controller, useForm, useWatch, type Resolver } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { ItemPicker } from '@/components/bookings/item-picker';
import { applyServerErrors } from '@/components/bookings/server-errors';
import { canPickFiles, pickFile } from '@/components/items/pick-file';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Checkbox } from '@/components/ui/checkbox';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormAlert } from '@/components/ui/form-alert';
import { FormTextField } from '@/components/ui/form-fields';
import { Screen } from '@/components/ui/screen';
import { useGearItems } from '@/hooks/use-booking-gear';
import { useBookingsQuery } from '@/hooks/use-bookings';
import { useBreakpoints } from '@/hooks/use-breakpoints';
import { useReportIncidentMutation, useUploadIncidentPhotoMutation } from '@/hooks/use-incidents';
import {
  INCIDENT_KINDS,
  INCIDENT_SEVERITIES,
  incidentCreateSchema,
  incidentKindWords,
  incidentSeverityWords,
  TAG_OUT_BY_DEFAULT,
  type IncidentCreateInput,
  type IncidentKind,
} from '@/shared/schemas/incidents';

import { OccurredAtField } from './occurred-at-field';
import { SeverityGuide } from './severity-guide';

const FIELDS = ['kind', 'severity', 'occurredAt', 'location', 'description', 'itemIds', 'bookingId', 'tagOut'] as const;

const KIND_CHOICES = INCIDENT_KINDS.map((kind) => ({ value: kind, label: incidentKindWords[kind].label }));
const SEVERITY_CHOICES = INCIDENT_SEVERITIES.map((severity) => ({ value: severity, label: incidentSeverityWords[severity].label }));

interface ReportIncidentScreenProps {
  /** From an item page: that item is already named. */
  itemId?: number;
  /** From a booking page: that booking, its gear and its place are already filled in. */
  bookingId?: number;
}

type Values = Omit<IncidentCreateInput, 'kind' | 'severity'> & { kind?: IncidentKind; severity?: IncidentCreateInput['severity'] };

/**
 * Report an incident or near miss in under a minute on a phone: what kind, how bad, when, where,
 * what happened, the gear and booking involved, photos, and whether to take the gear out of
 * service now (on by default for damage and shock).
 */
export function ReportIncidentScreen({ itemId, bookingId }: ReportIncidentScreenProps) {
  const { isWide } = useBreakpoints();
  const report = useReportIncidentMutation();
  const upload = useUploadIncidentPhotoMutation();
  const [photos, setPhotos] = useState<(Blob & { name: string })[]>([]);
  const current = useBookingsQuery({ mine: true, status: 'live', limit: 10 });
  const liveBookings = current.data?.bookings ?? [];
  const {
    control,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, IncidentCreateInput>({
    // Kind and severity start unchosen (no default answer to a safety question); the schema requires both.
    resolver: zodResolver(incidentCreateSchema) as unknown as Resolver<Values, unknown, IncidentCreateInput>,
    defaultValues: {
      occurredAt: new Date().toISOString(),
      location: '',
      description: '',
      itemIds: itemId ? [itemId] : [],
      bookingId: bookingId ?? null,
      tagOut: false,
    },
  });
  const values = useWatch({ control });
  const itemIds = (values.itemIds ?? []).filter((id): id is number => typeof id === 'number');
  const gear = useGearItems(itemIds);

  // "Take out of service" follows the kind until the reporter sets it themselves.
  const tagOutTouched = useRef(false);
  useEffect(() => {
    if (!tagOutTouched.current && values.kind) setValue('tagOut', TAG_OUT_BY_DEFAULT.includes(values.kind));
  }, [values.kind, setValue]);

  // A booking chosen (or arrived from) fills in its place and gear where they are still empty.
  const chosenBooking = liveBookings.find((b) => b.id === values.bookingId);
  useEffect(() => {
    if (chosenBooking && !values.location) setValue('location', chosenBooking.location);
  }, [chosenBooking, values.location, setValue]);
  const firstItem = gear.items[0];
  useEffect(() => {
    if (firstItem && !values.location) setValue('location', firstItem.location);
  }, [firstItem, values.location, setValue]);

  const onSubmit = handleSubmit(async (input) => {
    try {
      const incident = await report.mutateAsync(incidentCreateSchema.parse(input));
      for (const file of photos) await upload.mutateAsync({ incidentId: incident.id, file });
      router.replace({ pathname: '/incidents/[id]', params: { id: String(incident.id), sent: '1' } });
    } catch (error) {
      applyServerErrors(error, FIELDS, setError);
    }
  });

  const bookingChoices = [
    { value: 'none', label: 'None' },
    ...liveBookings.map((b) => ({ value: String(b.id), label: `#${b.id} ${b.itemTags.slice(0, 2).join(', ')}${b.itemTags.length > 2 ? '…' : ''}` })),
  ];

  return (
    <Screen testID="report-incident-screen" title="Report an incident" width={isWide ? 'regular' : 'regular'}>
      <AppText tone="muted">A shock, an arc-over, a burn, damaged gear or a near miss. The safety officers are e-mailed as soon as you send it.</AppText>
      <Card title="What happened">
        <Controller
          control={control}
          name="kind"
          render={({ field }) => (
            <ChoiceChips
              label="Kind"
              testID="incident-kind"
              choices={KIND_CHOICES}
              value={field.value}
              onChange={field.onChange}
              error={errors.kind?.message}
            />
          )}
        />
        {values.kind ? (
          <AppText variant="small" tone="muted">
            {incidentKindWords[values.kind].hint}
          </AppText>
        ) : null}
        <Controller
          control={control}
          name="severity"
          render={({ field }) => (
            <ChoiceChips
              label="Severity"
              testID="incident-severity"
              choices={SEVERITY_CHOICES}
              value={field.value}
              onChange={field.onChange}
              error={errors.severity?.message}
            />
          )}
        />
        {values.severity ? (
          <AppText variant="small" testID="incident-severity-definition">
            {incidentSeverityWords[values.severity].label}: {incidentSeverityWords[values.severity].definition}
          </AppText>
        ) : null}
        <SeverityToggle />
        <FormTextField
          control={control}
          name="description"
          label="What happened"
          hint="In a few words: what you were doing, what you saw, anyone hurt."
          multiline
          numberOfLines={4}
          testID="incident-description"
        />
      </Card>

      <Card title="When and where">
        <Controller
          control={control}
          name="occurredAt"
          render={({ field }) => <OccurredAtField value={field.value} onChange={field.onChange} error={errors.occurredAt?.message} />}
        />
        <FormTextField control={control} name="location" label="Where" hint="Bay, bench or room" testID="incident-location" />
      </Card>

      <Card title="Gear and booking">
        <Controller
          control={control}
          name="itemIds"
          render={({ field }) => (
            <ItemPicker value={field.value ?? []} onChange={field.onChange} picked={gear.items} window={null} error={errors.itemIds?.message} />
          )}
        />
        {liveBookings.length > 0 || bookingId ? (
          <Controller
            control={control}
            name="bookingId"
            render={({ field }) => (
              <ChoiceChips
                label="Booking (optional)"
                testID="incident-booking"
                choices={
                  bookingId && !liveBookings.some((b) => b.id === bookingId)
                    ? [...bookingChoices, { value: String(bookingId), label: `#${bookingId}` }]
                    : bookingChoices
                }
                value={field.value ? String(field.value) : 'none'}
                onChange={(v) => field.onChange(v === 'none' ? null : Number(v))}
                error={errors.bookingId?.message}
              />
            )}
          />
        ) : null}
        <Controller
          control={control}
          name="tagOut"
          render={({ field }) => (
            <Checkbox
              label="Take these items out of service now"
              detail={
                itemIds.length === 0
                  ? 'Name the gear above for this to apply.'
                  : 'They cannot be booked or released until a manager puts them back after an inspection.'
              }
              checked={field.value === true}
              onChange={(checked) => {
                tagOutTouched.current = true;
                field.onChange(checked);
              }}
              testID="incident-tag-out"
            />
          )}
        />
      </Card>

      {canPickFiles ? (
        <Card title="Photos (optional)">
          {photos.map((p, index) => (
            <View key={`${p.name}-${index}`} style={styles.photoRow}>
              <AppText style={styles.photoName}>{p.name}</AppText>
              <Button label={`Remove ${p.name}`} variant="secondary" icon="close" onPress={() => setPhotos((list) => list.filter((_, i) => i !== index))} />
            </View>
          ))}
          <Button
            label="Add a photo"
            icon="camera"
            variant="secondary"
            testID="incident-add-photo"
            onPress={async () => {
              const file = await pickFile('image/*', { capture: 'environment' });
              if (file) setPhotos((list) => [...list, file]);
            }}
          />
        </Card>
      ) : null}

      {errors.root?.server?.message ? <FormAlert message={errors.root.server.message} testID="incident-form-error" /> : null}
      <Button
        label="Send report"
        icon="alert-octagon"
        block
        loading={isSubmitting}
        loadingLabel="Sending the report"
        onPress={onSubmit}
        testID="incident-submit"
      />
    </Screen>
  );
}

function SeverityToggle() {
  const [open, setOpen] = useState(false);
  return (
    <View style={styles.guide}>
      <Button
        label={open ? 'Hide what the severities mean' : 'What do the severities mean?'}
        icon={open ? 'chevron-up' : 'help-circle'}
        variant="secondary"
        onPress={() => setOpen(!open)}
        testID="severity-guide-toggle"
      />
      {open ? <SeverityGuide /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  guide: { gap: spacing.sm },
  photoRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  photoName: { flex: 1, minWidth: 0 },
});
