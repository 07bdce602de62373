import { Pressable, StyleSheet, View } from 'react-native';

import { borders, iconSizes, layout, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon } from './icon';

export interface SegmentOption<V extends string> {
  value: V;
  label: string;
  testID?: string;
}

interface SegmentedControlProps<V extends string> {
  /** Names the group for assistive tech; shown above the options unless `hideLabel`. */
  label: string;
  hideLabel?: boolean;
  options: readonly SegmentOption<V>[];
  value: V;
  onChange: (value: V) => void;
  /**
   * `radio` picks a value (a unit, a role); `tab` switches what the screen shows below it.
   * Both wrap onto a second line rather than shrink a target below the gloved-finger minimum.
   */
  kind?: 'radio' | 'tab';
  testID?: string;
}

/**
 * A small set of mutually exclusive choices as large pills. The chosen one is filled and bold and
 * announced as checked/selected, so the state never rests on hue alone.
 */
export function SegmentedControl<V extends string>({ label, hideLabel = false, options, value, onChange, kind = 'radio', testID }: SegmentedControlProps<V>) {
  const { colors } = useTheme();
  return (
    <View style={styles.wrapper}>
      {hideLabel ? null : <AppText variant="label">{label}</AppText>}
      <View testID={testID} role={kind === 'tab' ? 'tablist' : 'radiogroup'} aria-label={label} style={styles.row}>
        {options.map((option) => {
          const chosen = option.value === value;
          return (
            <Pressable
              key={option.value}
              testID={option.testID}
              role={kind}
              aria-label={option.label}
              aria-checked={kind === 'radio' ? chosen : undefined}
              aria-selected={kind === 'tab' ? chosen : undefined}
              onPress={() => onChange(option.value)}
              style={({ pressed }) => [
                styles.option,
                {
                  backgroundColor: chosen ? colors.primary : colors.surface,
                  borderColor: chosen ? colors.primary : colors.borderStrong,
                },
                pressed && styles.pressed,
              ]}
            >
              {kind === 'radio' ? (
                <Icon name={chosen ? 'radiobox-marked' : 'radiobox-blank'} size={iconSizes.sm} color={chosen ? colors.onPrimary : colors.textMuted} />
              ) : null}
              <AppText variant={chosen ? 'label' : 'body'} color={chosen ? colors.onPrimary : colors.text}>
                {option.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrapper: { gap: spacing.xs, alignSelf: 'stretch' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  option: {
    minHeight: layout.minTouchTarget,
    minWidth: layout.minTouchTarget,
    paddingHorizontal: spacing.md,
    borderRadius: shapes.chipRadius,
    borderWidth: borders.control,
    flexDirection: 'row',
    gap: spacing.xxs,
    alignItems: 'center',
    justifyContent: 'center',
  },
  pressed: { opacity: 0.8 },
});
