import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { borders, shapes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Badge } from '@/components/ui/badge';

export type StepState = 'done' | 'current' | 'later';

interface StepCardProps {
  number: number;
  title: string;
  state: StepState;
  testID: string;
  children: ReactNode;
}

const stateWords: Record<StepState, { label: string; icon: 'check-circle' | 'chevron-right' | 'clock-outline' }> = {
  done: { label: 'Done', icon: 'check-circle' },
  current: { label: 'Now', icon: 'chevron-right' },
  later: { label: 'Later', icon: 'clock-outline' },
};

/** One numbered counter step; the current one carries a heavy edge so it is found at a glance. */
export function StepCard({ number, title, state, testID, children }: StepCardProps) {
  const { colors } = useTheme();
  const words = stateWords[state];
  return (
    <View
      testID={testID}
      style={[
        styles.card,
        { backgroundColor: colors.surface, borderColor: state === 'current' ? colors.primary : colors.border },
        state === 'current' && styles.current,
      ]}
    >
      <View style={styles.header}>
        <AppText variant="heading" headingLevel={2} style={styles.title}>{`${number}. ${title}`}</AppText>
        <Badge
          label={words.label}
          icon={words.icon}
          tone={state === 'current' ? 'primary' : state === 'done' ? 'neutral' : 'muted'}
          testID={`${testID}-state-${state}`}
        />
      </View>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: spacing.md, padding: spacing.md, borderWidth: borders.hairline, borderRadius: shapes.cardRadius },
  current: { borderWidth: borders.focusRing },
  header: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: spacing.xs },
  title: { flexShrink: 1 },
});
