// Whole-window states shown outside the navigator (before the session is known, or when the
// root layout itself failed), so they cannot use Screen, which needs a navigation context.
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { VoltcribMark } from '@/components/ui/voltcrib-mark';

function ShellFrame({ testID, children }: { testID: string; children: ReactNode }) {
  const { colors } = useTheme();
  return (
    <View testID={testID} role="main" style={[styles.frame, { backgroundColor: colors.background }]}>
      <View style={styles.column}>
        <VoltcribMark size={layout.markSizeLarge} />
        {children}
      </View>
    </View>
  );
}

export function BootScreen() {
  return (
    <ShellFrame testID="boot-screen">
      <LoadingState label="Starting Voltcrib" />
    </ShellFrame>
  );
}

interface SessionErrorScreenProps {
  error: unknown;
  onRetry: () => void;
  retrying: boolean;
}

export function SessionErrorScreen({ error, onRetry, retrying }: SessionErrorScreenProps) {
  return (
    <ShellFrame testID="session-error-screen">
      <ErrorState title="Voltcrib could not start" error={error} onRetry={onRetry} retrying={retrying} />
    </ShellFrame>
  );
}

interface RouteErrorScreenProps {
  onRetry: () => void;
}

export function RouteErrorScreen({ onRetry }: RouteErrorScreenProps) {
  return (
    <ShellFrame testID="route-error-screen">
      <ErrorState title="This screen failed to show" onRetry={onRetry} />
    </ShellFrame>
  );
}

const styles = StyleSheet.create({
  frame: { flex: 1, alignItems: 'center', justifyContent: 'center', padding: spacing.md },
  column: { width: '100%', maxWidth: layout.formMaxWidth, alignItems: 'center', gap: spacing.md },
});
