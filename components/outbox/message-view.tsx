import { Pressable, StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/common/format';
import { borders, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { webLinkProps } from '@/components/ui/web-link';
import type { MailboxMessage } from '@/hooks/use-mailbox';

import { splitMailText } from './mail-text';

/** One received e-mail as sent: its text line by line, each line with a link a full-size target. */
export function MessageView({ message }: { message: MailboxMessage }) {
  const { colors } = useTheme();
  const lines = splitMailText(message.text);
  return (
    <Card testID="outbox-message">
      <AppText variant="heading" headingLevel={2} testID="outbox-message-subject">
        {message.subject || '(no subject)'}
      </AppText>
      <View style={styles.meta}>
        <AppText variant="small" tone="muted">
          To: {message.to}
        </AppText>
        <AppText variant="small" tone="muted">
          Received: {formatDateTime(message.receivedAt)}
        </AppText>
      </View>
      <View style={[styles.body, { borderTopColor: colors.border }]} testID="outbox-message-text">
        {lines.map((line, index) =>
          line.hasLink ? (
            <LinkLine key={index} parts={line.parts} />
          ) : (
            // An empty line keeps the paragraph break of the original.
            <AppText key={index}>{line.parts.map((p) => (p.kind === 'text' ? p.text : p.url)).join('') || ' '}</AppText>
          ),
        )}
      </View>
    </Card>
  );
}

function LinkLine({ parts }: { parts: ReturnType<typeof splitMailText>[number]['parts'] }) {
  const { colors } = useTheme();
  const url = parts.find((p) => p.kind === 'link');
  if (!url || url.kind !== 'link') return null;
  return (
    <Pressable
      accessibilityRole="link"
      accessibilityLabel={`Open ${url.url}`}
      testID="outbox-message-link"
      {...webLinkProps(url.url, { newTab: true })}
      style={({ pressed }) => [styles.link, { borderColor: colors.borderStrong, backgroundColor: pressed ? colors.surfaceMuted : colors.surface }]}
    >
      <AppText>
        {parts.map((part, index) =>
          part.kind === 'text' ? (
            <AppText key={index}>{part.text}</AppText>
          ) : (
            <AppText key={index} tone="primary" variant="bodyStrong" style={styles.underline}>
              {part.url}
            </AppText>
          ),
        )}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  meta: { gap: spacing.xxs },
  body: { gap: spacing.xxs, borderTopWidth: borders.hairline, paddingTop: spacing.sm },
  link: {
    minHeight: layout.minTouchTarget,
    justifyContent: 'center',
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xs,
    borderWidth: borders.hairline,
    borderRadius: radii.md,
  },
  underline: { textDecorationLine: 'underline' },
});
