import { Link, type Href } from 'expo-router';
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { borders, layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

interface ListRowProps {
  title: string;
  subtitle?: string;
  icon?: IconName;
  /** Makes the row a link (a real anchor on the web). */
  href?: Href;
  /** Makes the row a button; for actions that are not navigation. */
  onPress?: () => void;
  /** Short status beside the title, e.g. a Badge. */
  trailing?: ReactNode;
  /** Tints the title and icon; for the one destructive row in a list (sign out). */
  tone?: 'default' | 'danger';
  /** Draw a divider above the row (every row but a list's first). */
  divided?: boolean;
  testID?: string;
}

export function ListRow({ title, subtitle, icon, href, onPress, trailing, tone = 'default', divided = false, testID }: ListRowProps) {
  const { colors } = useTheme();
  const navigable = href !== undefined || onPress !== undefined;
  const titleColor = tone === 'danger' ? colors.errorText : colors.text;

  const body = (
    <View style={styles.row}>
      {icon ? <Icon name={icon} color={tone === 'danger' ? colors.errorText : colors.textMuted} /> : null}
      <View style={styles.text}>
        <AppText variant="bodyStrong" color={titleColor}>
          {title}
        </AppText>
        {subtitle ? (
          <AppText variant="small" tone="muted">
            {subtitle}
          </AppText>
        ) : null}
      </View>
      {trailing}
      {href !== undefined ? <Icon name="chevron-right" color={colors.textMuted} /> : null}
    </View>
  );

  const frame = [styles.frame, divided && { borderTopWidth: borders.hairline, borderTopColor: colors.border }];

  if (!navigable) {
    return (
      <View testID={testID} style={frame}>
        {body}
      </View>
    );
  }

  // No aria-label: the row's name is its visible text (title, subtitle, badge), so people who
  // speak a link's words to press it say what they see (axe label-content-name-mismatch).
  const pressable = (
    <Pressable
      testID={testID}
      accessibilityRole={href !== undefined ? 'link' : 'button'}
      onPress={onPress}
      // Link's asChild Slot takes one flat style object: no arrays (it throws in development)
      // and no style callbacks (dropped).
      style={StyleSheet.flatten(frame)}
    >
      {body}
    </Pressable>
  );

  return href !== undefined ? (
    <Link href={href} asChild>
      {pressable}
    </Link>
  ) : (
    pressable
  );
}

const styles = StyleSheet.create({
  frame: { minHeight: layout.listRowMinHeight, justifyContent: 'center', paddingHorizontal: spacing.md },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, paddingVertical: spacing.sm },
  text: { flex: 1, gap: spacing.xxs },
});
