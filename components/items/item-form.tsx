// Register or edit one item. The form holds what the person typed; the shared itemCreateSchema
// (the one the server validates with) checks it, so a field error reads the same on both sides.
import { ERROR_CODES } from '@/shared/errors';
import { zodResolver } from '@hookform/resolvers/zod';
import { router } from 'expo-router';
import { useState } from 'react';
import { Controller, useForm, useWatch, type Control, type Resolver } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';

import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormAlert } from '@/components/ui/form-alert';
import { NumberField } from '@/components/ui/number-field';
import { FormTextField } from '@/components/ui/form-fields';
import { isApiError } from '@/hooks/api-client';
import { useCreateItemMutation, useUpdateItemMutation } from '@/hooks/use-items';
import {
  DEFAULT_INSPECTION_DAYS,
  ITEM_KINDS,
  KIND_LABELS,
  KIND_TAG_CODES,
  POLARITIES,
  itemCreateSchema,
  type Item,
  type ItemKind,
} from '@/shared/schemas/items';

import { POLARITY_LABELS, RATING_FIELDS, type RatingField } from './rating-fields';
import { applyServerErrors } from './server-errors';

type RatingValue = number | string | boolean | null | undefined;

export interface ItemFormValues {
  kind: ItemKind;
  tag: string;
  name: string;
  make: string;
  model: string;
  serial: string;
  location: string;
  notes: string;
  inspectionIntervalDays: number | undefined;
  ratings: Record<string, RatingValue>;
}

type ItemCreateOutput = z.output<typeof itemCreateSchema>;

function emptyRatings(kind: ItemKind): Record<string, RatingValue> {
  return Object.fromEntries(RATING_FIELDS[kind].map((field) => [field.name, field.input === 'optional-decimal' ? null : undefined]));
}

function valuesFor(item: Item | undefined): ItemFormValues {
  if (!item) {
    return {
      kind: 'multiplier',
      tag: '',
      name: '',
      make: '',
      model: '',
      serial: '',
      location: '',
      notes: '',
      inspectionIntervalDays: undefined,
      ratings: emptyRatings('multiplier'),
    };
  }
  return {
    kind: item.kind,
    tag: item.tag,
    name: item.name,
    make: item.make,
    model: item.model,
    serial: item.serial,
    location: item.location,
    notes: item.notes,
    inspectionIntervalDays: item.inspectionIntervalDays,
    ratings: { ...(item.ratings as Record<string, RatingValue>) },
  };
}

/** The request body the schema expects: an empty tag means "issue the next one". */
function toCreateBody(values: ItemFormValues) {
  const names = RATING_FIELDS[values.kind].map((field) => field.name);
  return {
    ...values,
    tag: values.tag.trim() === '' ? undefined : values.tag,
    ratings: Object.fromEntries(names.map((name) => [name, values.ratings[name]])),
  };
}

const schemaResolver = zodResolver(itemCreateSchema);
// The shared schema is a union keyed on `kind`, which react-hook-form cannot type field by field;
// the form's own flat shape is converted to the request body and checked by that same schema.
const resolver: Resolver<ItemFormValues, unknown, ItemCreateOutput> = (values, context, options) =>
  schemaResolver(toCreateBody(values) as never, context, options as never) as never;

const COMMON_FIELDS = new Set(['kind', 'tag', 'name', 'make', 'model', 'serial', 'location', 'notes', 'inspectionIntervalDays']);

interface ItemFormProps {
  /** Editing this item; registering a new one when absent. */
  item?: Item;
}

export function ItemForm({ item }: ItemFormProps) {
  const editing = item !== undefined;
  const create = useCreateItemMutation();
  const update = useUpdateItemMutation(item?.id ?? 0);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, setValue } = useForm<ItemFormValues, unknown, ItemCreateOutput>({
    resolver,
    defaultValues: valuesFor(item),
  });
  const kind = useWatch({ control, name: 'kind' });
  const pending = create.isPending || update.isPending;

  const showServerErrors = (error: unknown) => {
    if (isApiError(error) && error.code === ERROR_CODES.tagTaken) {
      setError('tag', { type: 'server', message: error.message });
      setFormError(null);
      return;
    }
    const ratingNames = new Set(RATING_FIELDS[kind].map((field) => field.name));
    setFormError(
      applyServerErrors(error, (path, message) => {
        // The edit route checks ratings on their own, so their paths come without "ratings.".
        const name = ratingNames.has(path) ? `ratings.${path}` : path;
        if (!COMMON_FIELDS.has(name) && !(name.startsWith('ratings.') && ratingNames.has(name.slice('ratings.'.length)))) return false;
        setError(name as 'name', { type: 'server', message }, { shouldFocus: true });
        return true;
      }),
    );
  };

  const submit = handleSubmit((body) => {
    setFormError(null);
    const open = (id: number, registered = false) =>
      router.replace({ pathname: '/gear/[id]', params: registered ? { id: String(id), registered: '1' } : { id: String(id) } });
    if (editing) {
      const { name, make, model, serial, location, notes, inspectionIntervalDays, ratings } = body;
      update.mutate(
        { name, make, model, serial, location, notes, inspectionIntervalDays, ratings },
        { onSuccess: ({ item: saved }) => open(saved.id), onError: showServerErrors },
      );
    } else {
      create.mutate(body, { onSuccess: ({ item: saved }) => open(saved.id, true), onError: showServerErrors });
    }
  });

  const changeKind = (next: ItemKind) => {
    setValue('kind', next);
    setValue('ratings', emptyRatings(next));
  };

  return (
    <View style={styles.form} testID="item-form">
      <Card title="What it is">
        {editing ? (
          <AppText testID="item-form-kind">{`${KIND_LABELS[kind]} (the kind is fixed once registered)`}</AppText>
        ) : (
          <Controller
            control={control}
            name="kind"
            render={({ field }) => (
              <ChoiceChips
                label="Kind"
                choices={ITEM_KINDS.map((value) => ({ value, label: KIND_LABELS[value] }))}
                value={field.value}
                onChange={changeKind}
                testID="item-form-kind"
              />
            )}
          />
        )}
        <FormTextField control={control} name="name" label="Name" hint="What people call it, e.g. 80 kV Cockcroft–Walton stack" testID="item-form-name" />
      </Card>

      <Card title="Ratings">
        <AppText variant="small" tone="muted">
          From the maker&apos;s plate or data sheet. Every value in the unit shown in its label.
        </AppText>
        {RATING_FIELDS[kind].map((field) => (
          <RatingInput key={`${kind}-${field.name}`} control={control} field={field} />
        ))}
      </Card>

      <Card title="Where and which">
        <FormTextField control={control} name="location" label="Kept at" hint="Room, bay or cabinet" testID="item-form-location" />
        {editing ? null : (
          <FormTextField
            control={control}
            name="tag"
            label="Asset tag (optional)"
            hint={`Leave empty to issue the next one, e.g. ${KIND_TAG_CODES[kind]}-0008. Tags are never reused.`}
            autoCapitalize="characters"
            testID="item-form-tag"
          />
        )}
        <FormTextField control={control} name="make" label="Make (optional)" testID="item-form-make" />
        <FormTextField control={control} name="model" label="Model (optional)" testID="item-form-model" />
        <FormTextField control={control} name="serial" label="Serial number (optional)" autoCapitalize="characters" testID="item-form-serial" />
        <Controller
          control={control}
          name="inspectionIntervalDays"
          render={({ field, fieldState }) => (
            <NumberField
              ref={field.ref}
              label="Inspection interval"
              unit="days"
              integer
              value={field.value}
              onChange={field.onChange}
              onBlur={field.onBlur}
              error={fieldState.error?.message}
              hint={`Leave empty for the lab's usual ${DEFAULT_INSPECTION_DAYS[kind]} days for this kind`}
              testID="item-form-interval"
            />
          )}
        />
        <FormTextField control={control} name="notes" label="Notes (optional)" multiline testID="item-form-notes" />
      </Card>

      {formError ? <FormAlert message={formError} testID="item-form-error" /> : null}
      <View style={styles.buttons}>
        <Button
          label={editing ? 'Save changes' : 'Register gear'}
          icon={editing ? 'check-circle' : 'plus'}
          onPress={() => void submit()}
          loading={pending}
          loadingLabel={editing ? 'Saving' : 'Registering'}
          testID="item-form-submit"
        />
        <Button
          label="Cancel"
          variant="secondary"
          disabled={pending}
          onPress={() => (router.canGoBack() ? router.back() : router.replace('/gear'))}
          testID="item-form-cancel"
        />
      </View>
    </View>
  );
}

const polarityChoices = POLARITIES.map((value) => ({ value, label: POLARITY_LABELS[value] }));
const yesNoChoices = [
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
] as const;

function RatingInput({ control, field: rating }: { control: Control<ItemFormValues, unknown, ItemCreateOutput>; field: RatingField }) {
  const testID = `item-form-rating-${rating.name}`;
  return (
    <Controller
      control={control}
      name={`ratings.${rating.name}`}
      render={({ field, fieldState }) => {
        const error = fieldState.error?.message;
        switch (rating.input) {
          case 'polarity':
            return (
              <ChoiceChips
                label={rating.label}
                choices={polarityChoices}
                value={typeof field.value === 'string' ? (field.value as (typeof POLARITIES)[number]) : undefined}
                onChange={field.onChange}
                error={error}
                testID={testID}
              />
            );
          case 'boolean':
            return (
              <ChoiceChips
                label={rating.label}
                choices={yesNoChoices}
                value={field.value === true ? 'yes' : field.value === false ? 'no' : undefined}
                onChange={(choice) => field.onChange(choice === 'yes')}
                error={error}
                testID={testID}
              />
            );
          default:
            return (
              <NumberField
                ref={field.ref}
                label={rating.label}
                unit={rating.unit}
                integer={rating.input === 'integer'}
                value={typeof field.value === 'number' ? field.value : field.value === null ? null : undefined}
                // An emptied optional rating means "none" (null), which the schema accepts.
                onChange={(value) => field.onChange(value === undefined && rating.input === 'optional-decimal' ? null : value)}
                onBlur={field.onBlur}
                error={error}
                hint={rating.hint}
                testID={testID}
              />
            );
        }
      }}
    />
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
});
