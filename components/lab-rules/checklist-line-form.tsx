import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormAlert } from '@/components/ui/form-alert';
import { NumberField } from '@/components/ui/number-field';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/hooks/api-client';
import { useCreateChecklistTemplateMutation } from '@/hooks/use-checklist-templates';
import { checklistTemplateItemSchema, type ChecklistTemplateItemInput } from '@/shared/schemas/bookings';
import { ITEM_KINDS, KIND_LABELS } from '@/shared/schemas/items';

type FormValues = ChecklistTemplateItemInput;

const KIND_CHOICES = [
  { value: 'confirm', label: 'Confirmation' },
  { value: 'reading', label: 'Reading with limits' },
  { value: 'photo', label: 'Photo' },
] as const;

const APPLIES_WITH = [{ value: 'any', label: 'Any set' }, ...ITEM_KINDS.map((kind) => ({ value: kind, label: KIND_LABELS[kind] }))] as const;

/** Adds one line to the pre-energize or make-safe checklist (officers; audited on the server). */
export function ChecklistLineForm() {
  const create = useCreateChecklistTemplateMutation();
  const [added, setAdded] = useState<string | null>(null);
  const { control, handleSubmit, reset, setError, formState } = useForm<FormValues>({
    resolver: zodResolver(checklistTemplateItemSchema) as never,
    defaultValues: {
      phase: 'pre',
      kind: 'confirm',
      text: '',
      unit: null,
      min: null,
      max: null,
      required: true,
      appliesFromKv: null,
      appliesWithKind: null,
      position: 500,
    },
  });
  const kind = useWatch({ control, name: 'kind' });
  // The limits are in the reading's own unit, once it is typed.
  const unit = useWatch({ control, name: 'unit' }) ?? '';
  const errors = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    setAdded(null);
    try {
      await create.mutateAsync(values);
      setAdded(values.text);
      reset();
    } catch (error) {
      const fieldErrors = isApiError(error) ? error.fieldErrors : undefined;
      for (const [field, messages] of Object.entries(fieldErrors ?? {})) setError(field as keyof FormValues, { message: messages[0] });
      if (!fieldErrors) setError('root', { message: error instanceof Error ? error.message : 'The line was not added.' });
    }
  });

  return (
    <View style={styles.form} testID="checklist-line-form">
      <Controller
        control={control}
        name="phase"
        render={({ field }) => (
          <ChoiceChips
            label="Checklist"
            choices={[
              { value: 'pre', label: 'Pre-energize' },
              { value: 'return', label: 'Make-safe' },
            ]}
            value={field.value}
            onChange={field.onChange}
            testID="checklist-line-phase"
          />
        )}
      />
      <Controller
        control={control}
        name="kind"
        render={({ field }) => (
          <ChoiceChips label="Kind of line" choices={KIND_CHOICES} value={field.value} onChange={field.onChange} testID="checklist-line-kind" />
        )}
      />
      <Controller
        control={control}
        name="text"
        render={({ field }) => (
          <TextField
            label="What to check"
            value={field.value}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            error={errors.text?.message}
            testID="checklist-line-text"
          />
        )}
      />
      {kind === 'reading' ? (
        <>
          <Controller
            control={control}
            name="unit"
            render={({ field }) => (
              <TextField
                label="Unit of the reading"
                value={field.value ?? ''}
                onChangeText={(t) => field.onChange(t || null)}
                error={errors.unit?.message}
                testID="checklist-line-unit"
              />
            )}
          />
          <Controller
            control={control}
            name="min"
            render={({ field }) => (
              <NumberField
                label="Lowest acceptable"
                unit={unit}
                value={field.value}
                onChange={(v) => field.onChange(v ?? null)}
                error={errors.min?.message}
                testID="checklist-line-min"
              />
            )}
          />
          <Controller
            control={control}
            name="max"
            render={({ field }) => (
              <NumberField
                label="Highest acceptable"
                unit={unit}
                value={field.value}
                onChange={(v) => field.onChange(v ?? null)}
                error={errors.max?.message}
                testID="checklist-line-max"
              />
            )}
          />
        </>
      ) : null}
      <Controller
        control={control}
        name="appliesFromKv"
        render={({ field }) => (
          <NumberField
            label="Applies from (planned voltage)"
            unit="kV"
            hint="Leave empty to apply at every voltage."
            value={field.value}
            onChange={(v) => field.onChange(v ?? null)}
            error={errors.appliesFromKv?.message}
            testID="checklist-line-from-kv"
          />
        )}
      />
      <Controller
        control={control}
        name="appliesWithKind"
        render={({ field }) => (
          <ChoiceChips
            label="Applies when the set holds"
            choices={APPLIES_WITH}
            value={(field.value ?? 'any') as (typeof APPLIES_WITH)[number]['value']}
            onChange={(v) => field.onChange(v === 'any' ? null : v)}
            testID="checklist-line-with-kind"
          />
        )}
      />
      <Controller
        control={control}
        name="required"
        render={({ field }) => (
          <Checkbox
            label="Required"
            detail="A release or return cannot go ahead without it."
            checked={Boolean(field.value)}
            onChange={field.onChange}
            testID="checklist-line-required"
          />
        )}
      />
      {errors.root?.message ? <FormAlert message={errors.root.message} testID="checklist-line-error" /> : null}
      {added ? <Badge label={`Added: ${added}`} icon="check-circle" tone="primary" testID="checklist-line-added" /> : null}
      <Button
        label="Add the line"
        icon="plus"
        onPress={() => void onSubmit()}
        loading={formState.isSubmitting}
        loadingLabel="Adding the line"
        testID="checklist-line-submit"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md, paddingTop: spacing.md },
});
