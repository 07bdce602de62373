import { StyleSheet, View } from 'react-native';

import { iconSizes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { isApiError } from '@/hooks/api-client';

import { AppText } from './app-text';
import { Button } from './button';
import { Icon } from './icon';

interface ErrorStateProps {
  /** What failed, e.g. "The people list did not load." */
  title: string;
  error?: unknown;
  onRetry?: () => void;
  retrying?: boolean;
  testID?: string;
}

/** A failed load: what failed, the server's reason when it gave one, and a way to try again. */
export function ErrorState({ title, error, onRetry, retrying = false, testID }: ErrorStateProps) {
  const { colors } = useTheme();
  return (
    <View testID={testID} accessibilityRole="alert" style={styles.root}>
      <Icon name="alert-circle-outline" size={iconSizes.lg} color={colors.errorText} />
      <AppText variant="heading" headingLevel={2} style={styles.centerText}>
        {title}
      </AppText>
      <AppText tone="muted" style={styles.centerText}>
        {describeError(error)}
      </AppText>
      {/* Gone or not allowed: the same request would fail again, so there is nothing to retry. */}
      {onRetry && !(isApiError(error) && (error.status === 404 || error.status === 403)) ? (
        <View>
          <Button label="Try again" icon="refresh" variant="secondary" onPress={onRetry} loading={retrying} loadingLabel="Trying again" />
        </View>
      ) : null}
    </View>
  );
}

export function describeError(error: unknown): string {
  if (isApiError(error)) return error.message;
  return 'Something went wrong. Try again.';
}

const styles = StyleSheet.create({
  root: { alignItems: 'center', gap: spacing.sm, paddingVertical: spacing.xl, paddingHorizontal: spacing.md },
  centerText: { textAlign: 'center' },
});
