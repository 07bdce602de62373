import { Pressable, StyleSheet, View } from 'react-native';

import { borders, iconSizes, layout, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { FieldError } from './field-error';
import { Icon, type IconName } from './icon';

export interface Choice<T extends string> {
  value: T;
  label: string;
  icon?: IconName;
}

interface ChoiceChipsProps<T extends string> {
  /** Names the group for assistive tech and shows above the chips. */
  label: string;
  /** Hide the visible label when a heading right above already says it. */
  hideLabel?: boolean;
  choices: readonly Choice<T>[];
  value: T | undefined;
  onChange: (value: T) => void;
  error?: string;
  /** Each chip gets `<testID>-<value>`. */
  testID?: string;
}

/** Pick one of a few: a row of large chips, the chosen one filled and ticked (not colour alone). */
export function ChoiceChips<T extends string>({ label, hideLabel = false, choices, value, onChange, error, testID }: ChoiceChipsProps<T>) {
  const { colors } = useTheme();
  const invalid = error !== undefined && error !== '';
  return (
    <View style={styles.wrapper} accessibilityRole="radiogroup" accessibilityLabel={label} testID={testID}>
      {hideLabel ? null : <AppText variant="label">{label}</AppText>}
      <View style={styles.row}>
        {choices.map((choice) => {
          const selected = choice.value === value;
          return (
            <Pressable
              key={choice.value}
              testID={testID ? `${testID}-${choice.value}` : undefined}
              accessibilityRole="radio"
              accessibilityLabel={choice.label}
              // React Native's aria-* props: react-native-web renders these (not accessibilityState).
              aria-checked={selected}
              onPress={() => onChange(choice.value)}
              style={({ pressed }) => [
                styles.chip,
                {
                  backgroundColor: selected ? colors.primary : colors.surface,
                  borderColor: invalid ? colors.errorText : selected ? colors.primary : colors.borderStrong,
                },
                pressed && styles.pressed,
              ]}
            >
              <Icon
                name={selected ? 'radiobox-marked' : (choice.icon ?? 'radiobox-blank')}
                size={iconSizes.sm}
                color={selected ? colors.onPrimary : colors.textMuted}
              />
              <AppText variant="label" color={selected ? colors.onPrimary : colors.text}>
                {choice.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
      {error ? <FieldError message={error} testID={testID ? `${testID}-error` : undefined} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrapper: { gap: spacing.xs, alignSelf: 'stretch' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  chip: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.xxs,
    minHeight: layout.minTouchTarget,
    paddingHorizontal: spacing.md,
    borderWidth: borders.control,
    borderRadius: shapes.chipRadius,
  },
  pressed: { opacity: 0.8 },
});
