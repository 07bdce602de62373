import { ActivityIndicator, Pressable, StyleSheet, View } from 'react-native';

import { borders, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

type Variant = 'primary' | 'secondary' | 'danger';

interface ButtonProps {
  /** Visible text and the accessible name; a button cannot exist without one. */
  label: string;
  onPress?: () => void;
  variant?: Variant;
  icon?: IconName;
  loading?: boolean;
  /** Shown to assistive tech while loading, e.g. "Signing in". */
  loadingLabel?: string;
  disabled?: boolean;
  testID?: string;
  /** Stretch to the column's width (phone forms); otherwise size to the label. */
  block?: boolean;
}

export function Button({ label, onPress, variant = 'primary', icon, loading = false, loadingLabel, disabled = false, testID, block = false }: ButtonProps) {
  const { colors } = useTheme();
  const inactive = disabled || loading;
  const palette = {
    primary: { fill: colors.primary, text: colors.onPrimary, edge: colors.primary },
    secondary: { fill: colors.surface, text: colors.text, edge: colors.borderStrong },
    danger: { fill: colors.danger, text: colors.onDanger, edge: colors.danger },
  }[variant];

  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={loading && loadingLabel ? loadingLabel : label}
      accessibilityState={{ disabled: inactive, busy: loading }}
      disabled={inactive}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [
        styles.base,
        block && styles.block,
        { backgroundColor: palette.fill, borderColor: palette.edge },
        pressed && styles.pressed,
        disabled && !loading && styles.disabled,
      ]}
    >
      <View style={styles.content}>
        {loading ? <ActivityIndicator color={palette.text} aria-hidden /> : icon ? <Icon name={icon} color={palette.text} /> : null}
        <AppText variant="label" color={palette.text}>
          {label}
        </AppText>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: layout.minTouchTarget,
    minWidth: layout.minTouchTarget,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.xs,
    borderRadius: radii.md,
    borderWidth: borders.control,
    alignItems: 'center',
    justifyContent: 'center',
    alignSelf: 'flex-start',
  },
  block: { alignSelf: 'stretch' },
  content: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
  pressed: { opacity: 0.8 },
  disabled: { opacity: 0.5 },
});
