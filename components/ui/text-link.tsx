import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet } from 'react-native';

import { layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

interface TextLinkProps {
  /** Visible text and the accessible name. */
  label: string;
  href: Href;
  icon?: IconName;
  testID?: string;
}

/**
 * A secondary way on ("Forgot your password?", "Back to sign in"): underlined text in a target
 * still tall enough for a gloved thumb. A real anchor on the web.
 */
export function TextLink({ label, href, icon, testID }: TextLinkProps) {
  const { colors } = useTheme();
  return (
    <Link href={href} asChild>
      <Pressable testID={testID} accessibilityRole="link" accessibilityLabel={label} style={styles.target}>
        {icon ? <Icon name={icon} color={colors.primary} /> : null}
        <AppText variant="label" tone="primary" style={styles.text}>
          {label}
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  // Link's asChild Slot takes one flat style object (see list-row.tsx).
  target: { minHeight: layout.minTouchTarget, flexDirection: 'row', alignItems: 'center', gap: spacing.xs, alignSelf: 'flex-start' },
  text: { textDecorationLine: 'underline' },
});
