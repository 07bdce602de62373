import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { borders, iconSizes, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Icon, type IconName } from '@/components/ui/icon';

interface CameraNoticeProps {
  title: string;
  /** What happened and what to do now; the typed tag below always works. */
  message: string;
  icon: IconName;
  action?: ReactNode;
  testID?: string;
}

/** Stands where the camera preview would be when the camera cannot (yet) be used. */
export function CameraNotice({ title, message, icon, action, testID }: CameraNoticeProps) {
  const { colors } = useTheme();
  return (
    <View testID={testID} accessibilityLiveRegion="polite" style={[styles.notice, { borderColor: colors.borderStrong, backgroundColor: colors.surface }]}>
      <View style={styles.titleRow}>
        <Icon name={icon} size={iconSizes.md} color={colors.text} />
        <AppText variant="bodyStrong" headingLevel={2}>
          {title}
        </AppText>
      </View>
      <AppText>{message}</AppText>
      {action ? <View>{action}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  notice: { gap: spacing.sm, padding: spacing.md, borderWidth: borders.control, borderRadius: radii.lg, borderStyle: 'dashed' },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
});
