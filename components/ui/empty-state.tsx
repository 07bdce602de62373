import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { iconSizes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

interface EmptyStateProps {
  title: string;
  message: string;
  icon?: IconName;
  /** At most one action (a Button), the obvious next step. */
  action?: ReactNode;
  /** 1 when the state is the whole screen (not found); 2 inside a screen with its own title. */
  headingLevel?: 1 | 2;
  testID?: string;
}

/** Nothing to show yet, said plainly, with what fills it. */
export function EmptyState({ title, message, icon = 'tray', action, headingLevel = 2, testID }: EmptyStateProps) {
  const { colors } = useTheme();
  return (
    <View testID={testID} style={styles.root}>
      <Icon name={icon} size={iconSizes.lg} color={colors.textMuted} />
      <AppText variant="heading" headingLevel={headingLevel} style={styles.centerText}>
        {title}
      </AppText>
      <AppText tone="muted" style={styles.centerText}>
        {message}
      </AppText>
      {action ? <View>{action}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { alignItems: 'center', gap: spacing.sm, paddingVertical: spacing.xl, paddingHorizontal: spacing.md },
  centerText: { textAlign: 'center' },
});
