import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { borders, fontFamilies, layout, radii, spacing, typeScale } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { TextLink } from '@/components/ui/text-link';
import type { AuditEvent } from '@/hooks/use-audit';

import { auditWords } from './audit-words';

/** Before and after as compact JSON: an inspector wants the stored values, not a paraphrase. */
function compact(value: unknown): string {
  if (value === null || value === undefined) return '—';
  return JSON.stringify(value, null, 1).replace(/\n\s*/g, ' ');
}

/** One entry of the trail: a sentence in the lab's words, when, a way to its subject, and the stored values on demand. */
export function AuditEventRow({ event, divided }: { event: AuditEvent; divided: boolean }) {
  const { colors } = useTheme();
  const [open, setOpen] = useState(false);
  const words = auditWords(event);
  const toggleText = open ? 'Hide the stored values' : 'Show the stored values';
  return (
    <View
      testID={`audit-event-${event.id}`}
      role="listitem"
      style={[styles.row, divided && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}
    >
      <AppText variant="bodyStrong" testID={`audit-event-${event.id}-sentence`}>
        {words.sentence}
      </AppText>
      {words.detail ? <AppText>{words.detail}</AppText> : null}
      <AppText variant="small" tone="muted">{`${formatDateTime(event.at)} · entry ${event.id}`}</AppText>
      <View style={styles.actions}>
        {words.link ? <TextLink label={words.link.label} href={words.link.href} testID={`audit-event-${event.id}-link`} /> : null}
        <Pressable
          accessibilityRole="button"
          accessibilityLabel={toggleText}
          aria-expanded={open}
          onPress={() => setOpen(!open)}
          style={styles.toggle}
          testID={`audit-event-${event.id}-toggle`}
        >
          <AppText variant="label" tone="muted">
            {toggleText}
          </AppText>
          <Icon name={open ? 'chevron-up' : 'chevron-down'} color={colors.textMuted} />
        </Pressable>
      </View>
      {open ? (
        <View style={styles.values}>
          <Values label="Before" value={event.before} />
          <Values label="After" value={event.after} />
        </View>
      ) : null}
    </View>
  );
}

function Values({ label, value }: { label: string; value: unknown }) {
  const { colors } = useTheme();
  return (
    <View style={styles.valueBlock}>
      <AppText variant="smallStrong">{label}</AppText>
      <AppText selectable variant="small" style={[styles.code, { backgroundColor: colors.surfaceMuted }]}>
        {compact(value)}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingHorizontal: spacing.md, paddingTop: spacing.sm, gap: spacing.xxs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: spacing.lg },
  toggle: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, minHeight: layout.minTouchTarget },
  values: { gap: spacing.sm, paddingBottom: spacing.md },
  valueBlock: { gap: spacing.xxs },
  code: { fontFamily: fontFamilies.regular, fontSize: typeScale.small.fontSize, padding: spacing.xs, borderRadius: radii.sm },
});
