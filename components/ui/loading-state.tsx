import { ActivityIndicator, StyleSheet, View } from 'react-native';

import { spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';

interface LoadingStateProps {
  /** What is loading, e.g. "Loading people". */
  label: string;
  testID?: string;
}

export function LoadingState({ label, testID }: LoadingStateProps) {
  const { colors } = useTheme();
  return (
    <View testID={testID} style={styles.root} accessibilityLiveRegion="polite" accessibilityRole="progressbar" accessibilityLabel={label}>
      {/* The spinner is its own unnamed progressbar on the web: hidden, the row above speaks for it. */}
      <ActivityIndicator size="large" color={colors.primary} aria-hidden />
      <AppText tone="muted">{label}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { alignItems: 'center', justifyContent: 'center', gap: spacing.sm, paddingVertical: spacing.xl },
});
