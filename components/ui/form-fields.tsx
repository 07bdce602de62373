import type { ComponentProps } from 'react';
import { Controller, type Control, type FieldPath, type FieldValues } from 'react-hook-form';

import { NumberField } from './number-field';
import { TextField } from './text-field';

// TOut: what the form's resolver turns the values into on submit (a zod schema's output).
type FormTextFieldProps<T extends FieldValues, TOut> = Omit<ComponentProps<typeof TextField>, 'value' | 'onChangeText' | 'onBlur' | 'ref' | 'error'> & {
  control: Control<T, unknown, TOut>;
  name: FieldPath<T>;
};

/**
 * A TextField bound to one react-hook-form field: its value, changes, blur, the field's message,
 * and the ref a failed submit focuses.
 */
export function FormTextField<T extends FieldValues, TOut = T>({ control, name, ...fieldProps }: FormTextFieldProps<T, TOut>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: { ref, value, onChange, onBlur }, fieldState }) => (
        // An optional field starts undefined; the input stays controlled with empty text.
        <TextField {...fieldProps} ref={ref} value={value ?? ''} onChangeText={onChange} onBlur={onBlur} error={fieldState.error?.message} />
      )}
    />
  );
}

type FormNumberFieldProps<T extends FieldValues, TOut> = Omit<ComponentProps<typeof NumberField>, 'value' | 'onChange' | 'onBlur' | 'ref' | 'error'> & {
  control: Control<T, unknown, TOut>;
  name: FieldPath<T>;
};

/** A NumberField bound to one react-hook-form field, as FormTextField is for text. */
export function FormNumberField<T extends FieldValues, TOut = T>({ control, name, ...fieldProps }: FormNumberFieldProps<T, TOut>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: { ref, value, onChange, onBlur }, fieldState }) => (
        <NumberField {...fieldProps} ref={ref} value={value} onChange={onChange} onBlur={onBlur} error={fieldState.error?.message} />
      )}
    />
  );
}

/** How an e-mail address is typed: the right keyboard, no capitals or autocorrect. */
export const EMAIL_INPUT = { inputMode: 'email', keyboardType: 'email-address', autoCapitalize: 'none', autoCorrect: false } as const;

/** How a password is typed: hidden, no capitals or autocorrect. */
export const PASSWORD_INPUT = { secureTextEntry: true, autoCapitalize: 'none', autoCorrect: false } as const;

/** How a new password is chosen: as a password, and offered to the browser's password manager. */
export const NEW_PASSWORD_INPUT = { ...PASSWORD_INPUT, autoComplete: 'new-password', textContentType: 'newPassword' } as const;
