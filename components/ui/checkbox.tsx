import { Pressable, StyleSheet, View } from 'react-native';

import { borders, iconSizes, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { FieldError } from './field-error';
import { Icon } from './icon';

interface CheckboxProps {
  /** The statement being confirmed; also the accessible name. */
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
  /** A second, quieter line (a limit, why it matters). */
  detail?: string;
  error?: string;
  disabled?: boolean;
  testID?: string;
}

/**
 * A confirmation the whole row of which is the target (gloved hands): box, statement, and its
 * state in words for anyone who cannot see the tick.
 */
export function Checkbox({ label, checked, onChange, detail, error, disabled = false, testID }: CheckboxProps) {
  const { colors } = useTheme();
  const invalid = error !== undefined && error !== '';
  return (
    <View style={styles.wrapper}>
      <Pressable
        testID={testID}
        accessibilityRole="checkbox"
        accessibilityLabel={label}
        // React Native's aria-* props: react-native-web renders these (not accessibilityState).
        aria-checked={checked}
        aria-disabled={disabled}
        disabled={disabled}
        onPress={() => onChange(!checked)}
        style={({ pressed }) => [
          styles.row,
          {
            backgroundColor: checked ? colors.primarySoft : colors.surface,
            borderColor: invalid ? colors.errorText : checked ? colors.primary : colors.borderStrong,
          },
          pressed && styles.pressed,
          disabled && styles.disabled,
        ]}
      >
        <Icon name={checked ? 'checkbox-marked' : 'checkbox-blank-outline'} size={iconSizes.md} color={checked ? colors.primary : colors.textMuted} />
        <View style={styles.text}>
          <AppText variant="bodyStrong">{label}</AppText>
          {detail ? (
            <AppText variant="small" tone="muted">
              {detail}
            </AppText>
          ) : null}
        </View>
      </Pressable>
      {error ? <FieldError message={error} testID={testID ? `${testID}-error` : undefined} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrapper: { gap: spacing.xxs, alignSelf: 'stretch' },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    minHeight: layout.minTouchTarget,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
    borderWidth: borders.control,
    borderRadius: radii.md,
  },
  text: { flex: 1, gap: spacing.xxs },
  pressed: { opacity: 0.8 },
  disabled: { opacity: 0.5 },
});
