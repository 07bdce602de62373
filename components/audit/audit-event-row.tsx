import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { borders, fontFamilies, layout, radii, spacing, typeScale } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import type { AuditEvent } from '@/hooks/use-audit';

/** Before and after as compact JSON: an inspector wants the stored values, not a paraphrase. */
function compact(value: unknown): string {
  if (value === null || value === undefined) return '—';
  return JSON.stringify(value, null, 1).replace(/\n\s*/g, ' ');
}

/** One entry of the trail: what happened to what, who did it and when; the values on demand. */
export function AuditEventRow({ event, divided }: { event: AuditEvent; divided: boolean }) {
  const { colors } = useTheme();
  const [open, setOpen] = useState(false);
  return (
    <View testID={`audit-event-${event.id}`} style={[styles.row, divided && { borderTopWidth: borders.hairline, borderTopColor: colors.border }]}>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={`${event.action} on ${event.entity} ${event.entityId}; ${open ? 'hide' : 'show'} the values`}
        aria-expanded={open}
        onPress={() => setOpen(!open)}
        style={styles.head}
        testID={`audit-event-${event.id}-toggle`}
      >
        <View style={styles.text}>
          <AppText variant="bodyStrong">{event.action}</AppText>
          <AppText variant="small" tone="muted">{`${event.entity} ${event.entityId} · ${event.actorName ?? 'the system'} · ${formatDateTime(event.at)} · #${event.id}`}</AppText>
        </View>
        <Icon name={open ? 'chevron-up' : 'chevron-down'} color={colors.textMuted} />
      </Pressable>
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
  row: { paddingHorizontal: spacing.md },
  head: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, minHeight: layout.listRowMinHeight, paddingVertical: spacing.xs },
  text: { flex: 1, gap: spacing.xxs },
  values: { gap: spacing.sm, paddingBottom: spacing.md },
  valueBlock: { gap: spacing.xxs },
  code: { fontFamily: fontFamilies.regular, fontSize: typeScale.small.fontSize, padding: spacing.xs, borderRadius: radii.sm },
});
