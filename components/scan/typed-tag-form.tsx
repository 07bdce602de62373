import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { spacing } from '@/components/theme/tokens';
import { Button } from '@/components/ui/button';
import { FormTextField } from '@/components/ui/form-fields';
import { tagSchema } from '@/shared/schemas/items';

import { extractTag } from './extract-tag';

// The shared tag rule, after the same extraction a scan gets: a pasted label URL works too.
const typedTagSchema = z.object({
  tag: z
    .string()
    .trim()
    .min(1, 'Type the tag printed under the QR code')
    .transform((text) => extractTag(text) ?? text)
    .pipe(tagSchema),
});

type TypedTagInput = z.input<typeof typedTagSchema>;
type TypedTag = z.output<typeof typedTagSchema>;

interface TypedTagFormProps {
  onTag: (tag: string) => void;
  disabled?: boolean;
  /** Says what the button does with the tag; "Open" (its page) unless the screen does something else. */
  submitLabel?: string;
  /** The field gets `<testID>-input`, the button `<testID>-submit`. */
  testID: string;
}

/** The fallback that always works: a worn label, a dark room, a browser without a camera. */
export function TypedTagForm({ onTag, disabled = false, submitLabel = 'Open', testID }: TypedTagFormProps) {
  const { control, handleSubmit, reset } = useForm<TypedTagInput, unknown, TypedTag>({
    resolver: zodResolver(typedTagSchema),
    defaultValues: { tag: '' },
  });

  const submit = handleSubmit(({ tag }) => {
    onTag(tag);
    reset({ tag: '' });
  });

  return (
    <View style={styles.row} testID={testID}>
      <View style={styles.field}>
        <FormTextField
          control={control}
          name="tag"
          label="Or type the tag"
          hint="Printed beside the QR code, e.g. MUL-0007"
          onSubmitEditing={() => void submit()}
          autoCapitalize="characters"
          autoCorrect={false}
          autoComplete="off"
          returnKeyType="go"
          disabled={disabled}
          testID={`${testID}-input`}
        />
      </View>
      <View style={styles.button}>
        <Button
          label={submitLabel}
          icon={submitLabel === 'Open' ? 'chevron-right' : 'check-circle'}
          variant="secondary"
          onPress={() => void submit()}
          disabled={disabled}
          testID={`${testID}-submit`}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.xs, alignSelf: 'stretch' },
  field: { flex: 1 },
  // Lines the button up with the input, below the field's label.
  button: { paddingTop: spacing.lg + spacing.xs },
});
