import { useEffect, useEffectEvent, useState, type Ref } from 'react';
import type { TextInput } from 'react-native';

import { TextField } from './text-field';

interface NumberFieldProps {
  /** The quantity, without its unit: the unit is added to the visible label. */
  label: string;
  /** Always shown: a number without its unit means nothing at the bench. */
  unit: string;
  value: number | null | undefined;
  /** `undefined` when empty, `NaN` when the text is not a number (the schema then refuses it). */
  onChange: (value: number | undefined) => void;
  onBlur?: () => void;
  error?: string;
  hint?: string;
  /** Whole numbers only (people, minutes). */
  integer?: boolean;
  disabled?: boolean;
  testID?: string;
  ref?: Ref<TextInput>;
}

/** Accepts a comma as the decimal mark too: half the lab writes 2,5 kV. */
export function parseNumber(text: string): number | undefined {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return undefined;
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(trimmed) ? Number(trimmed) : Number.NaN;
}

/** A labelled numeric input that keeps the typed text (so "2." survives) and reports a number. */
export function NumberField({ label, unit, value, onChange, onBlur, error, hint, integer = false, disabled, testID, ref }: NumberFieldProps) {
  const [text, setText] = useState(value === undefined || value === null || Number.isNaN(value) ? '' : String(value));

  // Follow outside changes (a reset, a prefilled edit) without fighting the person's typing.
  // Keyed on the value only (the typed text is read as it is then): typing must not rewrite it.
  const followValue = useEffectEvent((next: number | null | undefined) => {
    const typed = parseNumber(text);
    const same = typed === next || (typed !== undefined && next !== undefined && next !== null && Number.isNaN(typed) && Number.isNaN(next));
    if (!same) setText(next === undefined || next === null || Number.isNaN(next) ? '' : String(next));
  });
  useEffect(() => followValue(value), [value]);

  return (
    <TextField
      ref={ref}
      // No empty brackets when a reading has no unit yet (a checklist line being written).
      label={unit ? `${label} (${unit})` : label}
      value={text}
      onChangeText={(next) => {
        setText(next);
        onChange(parseNumber(next));
      }}
      onBlur={onBlur}
      error={error}
      hint={hint}
      disabled={disabled}
      testID={testID}
      inputMode={integer ? 'numeric' : 'decimal'}
      keyboardType={integer ? 'number-pad' : 'decimal-pad'}
      autoCorrect={false}
    />
  );
}
