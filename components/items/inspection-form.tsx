import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useFieldArray, useForm, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';

import { borders, radii, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormAlert } from '@/components/ui/form-alert';
import { NumberField } from '@/components/ui/number-field';
import { FormTextField } from '@/components/ui/form-fields';
import { TextField } from '@/components/ui/text-field';
import { useRecordInspectionMutation } from '@/hooks/use-inspections';
import { SAFETY_CAUTION } from '@/shared/rules/assessment';
import { inspectionCreateSchema, type Item } from '@/shared/schemas/items';

import { formatDay, localTodayIso } from './format-dates';
import { applyServerErrors } from './server-errors';

type InspectionValues = z.input<typeof inspectionCreateSchema>;
type InspectionOutput = z.output<typeof inspectionCreateSchema>;

const MAX_READINGS = 20;
const FIELD_PATH = /^(result|inspectedOn|notes|readings\.\d+\.(label|value|unit))$/;

interface InspectionFormProps {
  item: Item;
  onDone: (message: string) => void;
  onCancel: () => void;
}

/** Records one inspection; a failure tags the item out on the server in the same transaction. */
export function InspectionForm({ item, onDone, onCancel }: InspectionFormProps) {
  const { colors } = useTheme();
  const record = useRecordInspectionMutation(item.id);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm<InspectionValues, unknown, InspectionOutput>({
    resolver: zodResolver(inspectionCreateSchema),
    defaultValues: { inspectedOn: localTodayIso(), readings: [], notes: '' },
  });
  const readings = useFieldArray({ control, name: 'readings' });
  const result = useWatch({ control, name: 'result' });

  const submit = handleSubmit((values) => {
    setFormError(null);
    record.mutate(values, {
      onSuccess: ({ item: after }) =>
        onDone(
          values.result === 'fail'
            ? `Failed inspection saved. ${after.tag} is now tagged out of service.`
            : `Inspection saved. Next due ${after.nextInspectionDue ? formatDay(after.nextInspectionDue) : 'date not set'}.`,
        ),
      onError: (error) =>
        setFormError(
          applyServerErrors(error, (path, message) => {
            if (!FIELD_PATH.test(path)) return false;
            setError(path as 'notes', { type: 'server', message });
            return true;
          }),
        ),
    });
  });

  return (
    <View style={[styles.panel, { borderColor: colors.borderStrong, backgroundColor: colors.surface }]} testID="inspection-form">
      <AppText variant="heading" headingLevel={2}>
        {`Record an inspection of ${item.tag}`}
      </AppText>
      <AppText variant="small" tone="muted">
        {SAFETY_CAUTION}
      </AppText>
      <Controller
        control={control}
        name="result"
        render={({ field, fieldState }) => (
          <ChoiceChips
            label="Result"
            choices={[
              { value: 'pass', label: 'Passed', icon: 'check-circle' },
              { value: 'fail', label: 'Failed', icon: 'close-circle' },
            ]}
            value={field.value}
            onChange={field.onChange}
            error={fieldState.error ? 'Choose passed or failed' : undefined}
            testID="inspection-result"
          />
        )}
      />
      {result === 'fail' ? (
        <View style={[styles.warning, { borderColor: colors.errorText }]} testID="inspection-fail-warning">
          <AppText variant="bodyStrong" tone="error">
            {`Saving a failed inspection tags ${item.tag} out of service at once. It cannot be booked or released until a lab manager clears it.`}
          </AppText>
        </View>
      ) : null}
      <Controller
        control={control}
        name="inspectedOn"
        render={({ field, fieldState }) => (
          <TextField
            ref={field.ref}
            label="Inspected on"
            hint="Year-month-day, e.g. 2025-03-14; today or earlier"
            value={field.value ?? ''}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            error={fieldState.error ? friendlyDate(fieldState.error.message) : undefined}
            autoCorrect={false}
            inputMode="numeric"
            testID="inspection-date"
          />
        )}
      />
      <View style={styles.readings}>
        <AppText variant="label">Readings</AppText>
        {readings.fields.length === 0 ? (
          <AppText variant="small" tone="muted">
            Add what you measured, each with its unit (insulation resistance in MΩ, bleed-down time in s…).
          </AppText>
        ) : null}
        {readings.fields.map((reading, index) => (
          <View key={reading.id} style={[styles.reading, { borderColor: colors.border }]} testID={`inspection-reading-${index}`}>
            <Controller
              control={control}
              name={`readings.${index}.label`}
              render={({ field, fieldState }) => (
                <TextField
                  ref={field.ref}
                  label="What was measured"
                  value={field.value}
                  onChangeText={field.onChange}
                  onBlur={field.onBlur}
                  error={fieldState.error ? 'Name the reading' : undefined}
                  testID={`inspection-reading-${index}-label`}
                />
              )}
            />
            <ReadingValue control={control} index={index} />
            <Button
              label="Remove this reading"
              icon="close"
              variant="secondary"
              onPress={() => readings.remove(index)}
              testID={`inspection-reading-${index}-remove`}
            />
          </View>
        ))}
        {readings.fields.length < MAX_READINGS ? (
          <Button
            label="Add a reading"
            icon="plus"
            variant="secondary"
            onPress={() => readings.append({ label: '', value: Number.NaN, unit: '' }, { shouldFocus: true })}
            testID="inspection-add-reading"
          />
        ) : null}
      </View>
      <FormTextField
        control={control}
        name="notes"
        label={result === 'fail' ? 'What failed' : 'Notes'}
        hint={result === 'fail' ? 'Becomes the tag-out reason' : 'Optional'}
        multiline
        testID="inspection-notes"
      />
      {formError ? <FormAlert message={formError} testID="inspection-form-error" /> : null}
      <View style={styles.buttons}>
        <Button
          label="Save inspection"
          icon="check-circle"
          onPress={() => void submit()}
          loading={record.isPending}
          loadingLabel="Saving the inspection"
          testID="inspection-submit"
        />
        <Button label="Cancel" variant="secondary" onPress={onCancel} disabled={record.isPending} testID="inspection-cancel" />
      </View>
    </View>
  );
}

function friendlyDate(message: string | undefined): string {
  return message && !/invalid/i.test(message) ? message : 'Use year-month-day, e.g. 2025-03-14';
}

/** The unit first, so the value's label can carry it ("Value (MΩ)"): no number without its unit. */
function ReadingValue({ control, index }: { control: ReturnType<typeof useForm<InspectionValues, unknown, InspectionOutput>>['control']; index: number }) {
  const unit = useWatch({ control, name: `readings.${index}.unit` });
  return (
    <View style={styles.valueRow}>
      <View style={styles.unit}>
        <Controller
          control={control}
          name={`readings.${index}.unit`}
          render={({ field, fieldState }) => (
            <TextField
              ref={field.ref}
              label="Unit"
              value={field.value}
              onChangeText={field.onChange}
              onBlur={field.onBlur}
              error={fieldState.error ? 'Give the unit' : undefined}
              autoCorrect={false}
              autoCapitalize="none"
              testID={`inspection-reading-${index}-unit`}
            />
          )}
        />
      </View>
      <View style={styles.value}>
        <Controller
          control={control}
          name={`readings.${index}.value`}
          render={({ field, fieldState }) => (
            <NumberField
              ref={field.ref}
              label="Value"
              unit={unit && unit.trim() !== '' ? unit.trim() : 'unit first'}
              value={field.value}
              onChange={(value) => field.onChange(value ?? Number.NaN)}
              onBlur={field.onBlur}
              error={fieldState.error?.message}
              testID={`inspection-reading-${index}-value`}
            />
          )}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: spacing.md, padding: spacing.md, borderWidth: borders.control, borderRadius: shapes.cardRadius },
  warning: { padding: spacing.sm, borderWidth: borders.control, borderLeftWidth: spacing.xs, borderRadius: radii.md },
  readings: { gap: spacing.sm },
  reading: { gap: spacing.sm, padding: spacing.sm, borderWidth: borders.hairline, borderRadius: radii.md },
  valueRow: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  unit: { flexBasis: '30%', flexGrow: 1 },
  value: { flexBasis: '60%', flexGrow: 2 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
});
