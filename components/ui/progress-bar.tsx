import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';

interface ProgressBarProps {
  /** What is under way, e.g. "Uploading barrier.jpg". */
  label: string;
  /** 0 to 1. */
  fraction: number;
  testID?: string;
}

/** A determinate progress bar with its label and percentage in words (announced as a progress bar). */
export function ProgressBar({ label, fraction, testID }: ProgressBarProps) {
  const { colors } = useTheme();
  const percent = Math.round(Math.min(1, Math.max(0, fraction)) * 100);
  return (
    <View style={styles.wrapper} testID={testID}>
      <AppText variant="small" testID={testID ? `${testID}-text` : undefined}>{`${label}: ${percent} %`}</AppText>
      <View
        accessibilityRole="progressbar"
        accessibilityLabel={label}
        accessibilityValue={{ min: 0, max: 100, now: percent }}
        style={[styles.track, { backgroundColor: colors.surfaceMuted, borderColor: colors.border }]}
      >
        <View style={[styles.fill, { width: `${percent}%`, backgroundColor: colors.primary }]} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrapper: { gap: spacing.xxs, alignSelf: 'stretch' },
  track: { height: 8, borderRadius: radii.pill, borderWidth: borders.hairline, overflow: 'hidden' },
  fill: { height: '100%', borderRadius: radii.pill },
});
