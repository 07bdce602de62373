import type { CSSProperties } from 'react';
import { StyleSheet, View } from 'react-native';

import { borders, fontFamilies, layout, radii, spacing, typeScale } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import type { PlatformDateTimeProps } from './platform-date-time';

const WALL = /^\s*(\d{4}-\d{2}-\d{2})[ T]+(\d{2}:\d{2})\s*$/;

/**
 * The browser's date and time inputs, kept in step with the typed field: picking writes the text,
 * typing a whole time moves the pickers. Both speak the same wall clock (the lab's), so the typed
 * field's checks for clock changes still apply to a picked time.
 */
export function PlatformDateTime({ text, onText, label, testID }: PlatformDateTimeProps) {
  const { colors, scheme } = useTheme();
  const match = WALL.exec(text);
  const date = match?.[1] ?? '';
  const time = match?.[2] ?? '';
  const style: CSSProperties = {
    minHeight: layout.minTouchTarget,
    padding: `0 ${spacing.sm}px`,
    border: `${borders.control}px solid ${colors.borderStrong}`,
    borderRadius: radii.md,
    background: colors.surface,
    color: colors.text,
    fontFamily: fontFamilies.regular,
    fontSize: typeScale.body.fontSize,
    colorScheme: scheme,
    flex: 1,
    minWidth: 0,
  };
  return (
    <View style={styles.row}>
      <AppText variant="small" tone="muted">
        Or pick:
      </AppText>
      <input
        type="date"
        aria-label={`${label}: date`}
        data-testid={`${testID}-date`}
        value={date}
        style={style}
        onChange={(event) => event.target.value && onText(`${event.target.value} ${time || '09:00'}`)}
      />
      <input
        type="time"
        aria-label={`${label}: time`}
        data-testid={`${testID}-time`}
        value={time}
        step={300}
        style={style}
        onChange={(event) => event.target.value && onText(`${date || new Date().toISOString().slice(0, 10)} ${event.target.value}`)}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, flexWrap: 'wrap' },
});
