import { StyleSheet, Text, type TextProps } from 'react-native';

import { typeScale, type TextVariant } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { webA11y } from './web-a11y';

type Tone = 'default' | 'muted' | 'primary' | 'error';

interface AppTextProps extends TextProps {
  variant?: TextVariant;
  tone?: Tone;
  /** Marks the text as a heading of this level (h1 on the web for level 1). */
  headingLevel?: 1 | 2 | 3;
  /** Overrides the tone, for text drawn on a coloured fill (badges, buttons). */
  color?: string;
}

export function AppText({ variant = 'body', tone = 'default', headingLevel, color, style, ...rest }: AppTextProps) {
  const { colors } = useTheme();
  const type = typeScale[variant];
  const toneColor = { default: colors.text, muted: colors.textMuted, primary: colors.primary, error: colors.errorText }[tone];
  return (
    <Text
      {...webA11y({ headingLevel })}
      {...rest}
      style={[styles.base, { fontFamily: type.family, fontSize: type.fontSize, lineHeight: type.lineHeight, color: color ?? toneColor }, style]}
    />
  );
}

const styles = StyleSheet.create({
  base: { flexShrink: 1 },
});
