import { Pressable, StyleSheet } from 'react-native';

import { borders, layout, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { webLinkProps } from '@/components/ui/web-link';

interface DownloadLinkProps {
  label: string;
  url: string;
  fileName: string;
  testID?: string;
}

/** A CSV download: a real link, so the browser saves the file with the session cookie sent. */
export function DownloadLink({ label, url, fileName, testID }: DownloadLinkProps) {
  const { colors } = useTheme();
  return (
    <Pressable
      testID={testID}
      accessibilityRole="link"
      accessibilityLabel={label}
      {...webLinkProps(url, { download: fileName })}
      style={({ pressed }) => [styles.link, { borderColor: colors.borderStrong, backgroundColor: pressed ? colors.surfaceMuted : colors.surface }]}
    >
      <AppText variant="label">{label}</AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  link: {
    minHeight: layout.minTouchTarget,
    paddingHorizontal: spacing.lg,
    justifyContent: 'center',
    alignItems: 'center',
    alignSelf: 'flex-start',
    borderWidth: borders.control,
    borderRadius: radii.md,
  },
});
