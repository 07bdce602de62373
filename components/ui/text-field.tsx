import { useId, useState, type Ref } from 'react';
import { Pressable, StyleSheet, TextInput, View, type TextInputProps } from 'react-native';

import { borders, fontFamilies, layout, radii, spacing, typeScale } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { FieldError } from './field-error';
import { Icon } from './icon';
import { webA11y } from './web-a11y';

interface TextFieldProps extends Omit<TextInputProps, 'style' | 'accessibilityLabel' | 'placeholderTextColor' | 'editable'> {
  /** Visible label and the input's accessible name; a field cannot exist without one. */
  label: string;
  /** Shown under the field in place of the hint, and marks the field invalid. */
  error?: string;
  hint?: string;
  disabled?: boolean;
  ref?: Ref<TextInput>;
}

/**
 * A labelled text input. Pass react-hook-form's Controller `field` through value/onChangeText/
 * onBlur/ref so a failed submit can focus it.
 */
export function TextField({ label, error, hint, disabled = false, testID, ref, onFocus, onBlur, secureTextEntry, ...inputProps }: TextFieldProps) {
  const { colors } = useTheme();
  const [focused, setFocused] = useState(false);
  const invalid = error !== undefined && error !== '';
  const messageId = useId();
  const hasMessage = invalid || (hint !== undefined && hint !== '');
  // A password can be shown while typing on a phone, where one wrong tap is hard to spot.
  const [revealed, setRevealed] = useState(false);

  return (
    <View style={styles.wrapper}>
      <AppText variant="label">{label}</AppText>
      <TextInput
        {...inputProps}
        secureTextEntry={secureTextEntry === true && !revealed}
        ref={ref}
        testID={testID}
        accessibilityLabel={label}
        {...webA11y({ invalid, describedBy: hasMessage ? messageId : undefined })}
        editable={!disabled}
        placeholderTextColor={colors.textMuted}
        onFocus={(event) => {
          setFocused(true);
          onFocus?.(event);
        }}
        onBlur={(event) => {
          setFocused(false);
          onBlur?.(event);
        }}
        style={[
          styles.input,
          {
            color: colors.text,
            backgroundColor: colors.surface,
            borderColor: invalid ? colors.errorText : colors.borderStrong,
          },
          focused && { outlineColor: colors.focus, outlineWidth: borders.focusRing, outlineStyle: 'solid', outlineOffset: 2 },
          disabled && styles.disabled,
        ]}
      />
      {secureTextEntry ? (
        <Pressable
          accessibilityRole="button"
          aria-pressed={revealed}
          onPress={() => setRevealed(!revealed)}
          style={styles.reveal}
          testID={testID ? `${testID}-show` : undefined}
        >
          <Icon name={revealed ? 'checkbox-marked' : 'checkbox-blank-outline'} color={colors.textMuted} />
          <AppText variant="label" tone="muted">
            Show password
          </AppText>
        </Pressable>
      ) : null}
      {error ? (
        <FieldError message={error} nativeID={messageId} testID={testID ? `${testID}-error` : undefined} />
      ) : hint ? (
        <AppText variant="small" tone="muted" nativeID={messageId}>
          {hint}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrapper: { gap: spacing.xs, alignSelf: 'stretch' },
  input: {
    minHeight: layout.minTouchTarget + spacing.xs,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
    borderWidth: borders.control,
    borderRadius: radii.md,
    fontFamily: fontFamilies.regular,
    fontSize: typeScale.body.fontSize,
  },
  disabled: { opacity: 0.6 },
  reveal: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, minHeight: layout.minTouchTarget, alignSelf: 'flex-start' },
});
