import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { applyServerErrors } from '@/components/bookings/server-errors';
import { trimNumber } from '@/components/assessment/quantities';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormAlert } from '@/components/ui/form-alert';
import { NumberField } from '@/components/ui/number-field';
import { useUpdateLabRulesMutation } from '@/hooks/use-lab-rules';
import { labRulesSchema, type LabRules } from '@/shared/schemas/bookings';

import { RULE_FIELDS } from './rule-fields';

/** The lab's rules, each with its unit, its default and why; saving is audited on the server. */
export function LabRulesForm({ rules }: { rules: LabRules }) {
  const save = useUpdateLabRulesMutation();
  const [saved, setSaved] = useState(false);
  const {
    control,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<LabRules>({ resolver: zodResolver(labRulesSchema), defaultValues: rules });

  const onSubmit = handleSubmit(async (input) => {
    setSaved(false);
    try {
      const next = await save.mutateAsync(input);
      reset(next);
      setSaved(true);
    } catch (error) {
      applyServerErrors(
        error,
        RULE_FIELDS.map((f) => f.name),
        setError,
      );
    }
  });

  return (
    <View style={styles.root}>
      <Card>
        {RULE_FIELDS.map((field) => (
          <View key={field.name} style={styles.field}>
            <Controller
              control={control}
              name={field.name}
              render={({ field: f }) => (
                <NumberField
                  ref={f.ref}
                  label={field.label}
                  unit={field.unit}
                  integer={field.integer}
                  value={f.value}
                  onChange={(v) => {
                    setSaved(false);
                    f.onChange(v);
                  }}
                  onBlur={f.onBlur}
                  error={errors[field.name]?.message}
                  testID={`lab-rule-${field.name}`}
                />
              )}
            />
            <AppText variant="small" tone="muted" testID={`lab-rule-${field.name}-why`}>
              {`Default ${trimNumber(field.defaultValue, 3)} ${field.unit}. ${field.justification}`}
            </AppText>
          </View>
        ))}
      </Card>
      {errors.root?.server?.message ? <FormAlert message={errors.root.server.message} testID="lab-rules-error" /> : null}
      {saved ? <Badge label="Saved. The change is in the audit trail." icon="check-circle" tone="primary" testID="lab-rules-saved" /> : null}
      <Button
        label="Save the rules"
        icon="book-cog"
        block
        disabled={!isDirty}
        loading={isSubmitting}
        loadingLabel="Saving"
        testID="lab-rules-save"
        onPress={() => void onSubmit()}
      />
      <AppText variant="small" tone="muted">
        New rules apply to assessments and releases from now on; bookings already made keep their stored assessment until their plan changes or they are
        released.
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.lg },
  field: { gap: spacing.xs },
});
