import { Redirect, router } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { useCurrentUser } from '@/hooks/use-session';

interface ItemByTagScreenProps {
  tag: string;
}

/** Where a QR label opened by any phone camera lands. Signed-out visitors sign in and return here. */
export function ItemByTagScreen({ tag }: ItemByTagScreenProps) {
  const { colors } = useTheme();
  const user = useCurrentUser();

  if (!user) {
    return <Redirect href={{ pathname: '/sign-in', params: { next: `/i/${encodeURIComponent(tag)}` } }} />;
  }

  return (
    <Screen testID="item-by-tag-screen" title="Scanned label">
      <View style={[styles.tag, { borderColor: colors.borderStrong, backgroundColor: colors.surface }]}>
        <AppText variant="small" tone="muted">
          Asset tag
        </AppText>
        <AppText variant="display" testID="item-tag" selectable>
          {tag}
        </AppText>
      </View>
      <AppText>Opening the item behind this label arrives with the registry work.</AppText>
      <Button label="Go to Today" icon="home-lightning-bolt" block onPress={() => router.replace('/')} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  tag: { gap: spacing.xxs, padding: spacing.md, borderWidth: borders.control, borderRadius: radii.md, borderStyle: 'dashed' },
});
