import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { HazardBadge } from '@/components/ui/hazard-badge';
import { Icon } from '@/components/ui/icon';

import type { Notice, ResultSection } from './calculators/types';

/** One block of results: each value with its unit and formula, then notices, then where it comes from. */
export function ResultSectionView({ section }: { section: ResultSection }) {
  const { colors } = useTheme();
  return (
    <Card title={section.title} testID={`planner-section-${section.key}`}>
      {section.waiting ? (
        <View style={styles.waiting} accessibilityLiveRegion="polite">
          <Icon name="information" color={colors.textMuted} />
          <AppText tone="muted" style={styles.flex} testID={`planner-waiting-${section.key}`}>
            {section.waiting}
          </AppText>
        </View>
      ) : (
        <>
          <View style={styles.lines}>
            {section.lines.map((line, index) => (
              <View key={line.key} style={[styles.line, index > 0 && { borderTopColor: colors.border, borderTopWidth: borders.hairline }]}>
                <AppText variant="small" tone="muted">
                  {line.label}
                </AppText>
                <AppText variant="heading" testID={`planner-result-${line.key}`} accessibilityLiveRegion="polite">
                  {line.value}
                </AppText>
                {line.formula ? (
                  <AppText variant="small" tone="muted">
                    {line.formula}
                  </AppText>
                ) : null}
              </View>
            ))}
          </View>
          {section.notices.map((notice) => (
            <NoticeView key={notice.key} notice={notice} />
          ))}
          {section.source ? (
            <AppText variant="small" tone="muted" testID={`planner-source-${section.key}`}>
              Source: {section.source}
            </AppText>
          ) : null}
          {section.facts.map((fact) => (
            <AppText key={fact} variant="small" tone="muted">
              {fact}
            </AppText>
          ))}
        </>
      )}
    </Card>
  );
}

function NoticeView({ notice }: { notice: Notice }) {
  const { colors } = useTheme();
  return (
    <View testID={`planner-notice-${notice.key}`} style={[styles.notice, { borderColor: colors.hazard[notice.level].edge, backgroundColor: colors.surface }]}>
      <HazardBadge level={notice.level} detail={notice.title} />
      <AppText>{notice.text}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  waiting: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.xs },
  flex: { flex: 1 },
  lines: { gap: 0 },
  line: { paddingVertical: spacing.xs, gap: spacing.xxs },
  notice: { gap: spacing.xs, padding: spacing.sm, borderWidth: borders.control, borderLeftWidth: spacing.xs, borderRadius: radii.md },
});
