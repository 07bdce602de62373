import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { NumberField } from '@/components/ui/number-field';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/hooks/api-client';
import { useSetQualificationMutation, type QualifiedPerson } from '@/hooks/use-qualification';
import { qualificationSchema, type QualificationInput } from '@/shared/schemas/bookings';

/** Records one person's authorised voltage and its expiry; the release rules read it. */
export function QualificationForm({ person, onDone, onCancel }: { person: QualifiedPerson; onDone: (message: string) => void; onCancel: () => void }) {
  const save = useSetQualificationMutation(person.id);
  const { control, handleSubmit, setError, setFocus, formState } = useForm<QualificationInput>({
    resolver: zodResolver(qualificationSchema) as never,
    defaultValues: { authorisedKv: person.qualification?.authorisedKv ?? 0, expiresOn: person.qualification?.expiresOn ?? '', notes: '' },
  });
  const errors = formState.errors;
  // Focus brings the form's first field into view (and the keyboard up) where it opened.
  useEffect(() => setFocus('authorisedKv'), [setFocus]);
  const onSubmit = handleSubmit(async (input) => {
    try {
      await save.mutateAsync(input);
      onDone(`${person.name}: HV up to ${input.authorisedKv} kV until ${input.expiresOn}.`);
    } catch (error) {
      const fieldErrors = isApiError(error) ? error.fieldErrors : undefined;
      for (const [field, messages] of Object.entries(fieldErrors ?? {})) setError(field as keyof QualificationInput, { message: messages[0] });
      if (!fieldErrors) setError('root', { message: error instanceof Error ? error.message : 'Not saved.' });
    }
  });
  return (
    <View style={styles.form} testID="qualification-form">
      <Controller
        control={control}
        name="authorisedKv"
        render={({ field }) => (
          <NumberField
            ref={field.ref}
            label="Authorised up to"
            unit="kV"
            value={field.value}
            onChange={field.onChange}
            error={errors.authorisedKv?.message}
            testID="qualification-kv"
          />
        )}
      />
      <Controller
        control={control}
        name="expiresOn"
        render={({ field }) => (
          <TextField
            label="Expires on (YYYY-MM-DD)"
            hint="Retraining interval: at most 3 years for qualified persons (NFPA 70E), or the lab's own."
            value={field.value}
            onChangeText={field.onChange}
            error={errors.expiresOn?.message}
            testID="qualification-expires"
          />
        )}
      />
      <Controller
        control={control}
        name="notes"
        render={({ field }) => (
          <TextField
            label="Course or evidence"
            value={field.value ?? ''}
            onChangeText={field.onChange}
            error={errors.notes?.message}
            testID="qualification-notes"
          />
        )}
      />
      {errors.root?.message ? <FormAlert message={errors.root.message} testID="qualification-error" /> : null}
      <View style={styles.actions}>
        <Button
          label="Save the qualification"
          icon="badge-account"
          onPress={() => void onSubmit()}
          loading={formState.isSubmitting}
          loadingLabel="Saving"
          testID="qualification-save"
        />
        <Button label="Cancel" variant="secondary" onPress={onCancel} disabled={formState.isSubmitting} testID="qualification-cancel" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
