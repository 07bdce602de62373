import type { Href } from 'expo-router';
import { router } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { iconSizes, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { TextLink } from '@/components/ui/text-link';

interface LinkProblemProps {
  testID: string;
  title: string;
  message: string;
  /** The way to a fresh link, when the person can get one themselves. */
  retry?: { label: string; href: Href };
}

/** A one-time link that was already used, has expired, or was never valid. */
export function LinkProblem({ testID, title, message, retry }: LinkProblemProps) {
  const { colors } = useTheme();
  return (
    <Card>
      <View testID={testID} accessibilityRole="alert" style={styles.body}>
        <Icon name="alert-circle-outline" size={iconSizes.lg} color={colors.errorText} />
        <AppText variant="heading" headingLevel={2}>
          {title}
        </AppText>
        <AppText>{message}</AppText>
        {retry ? <Button label={retry.label} icon="refresh" block onPress={() => router.replace(retry.href)} testID={`${testID}-retry`} /> : null}
        <TextLink label="Back to sign in" href="/sign-in" testID={`${testID}-sign-in`} />
      </View>
    </Card>
  );
}

interface LinkDoneProps {
  testID: string;
  title: string;
  message: string;
}

/** The password is set: the next step is signing in with it. */
export function LinkDone({ testID, title, message }: LinkDoneProps) {
  const { colors } = useTheme();
  return (
    <Card>
      <View testID={testID} accessibilityRole="alert" style={styles.body}>
        <Icon name="account-check" size={iconSizes.lg} color={colors.primary} />
        <AppText variant="heading" headingLevel={2}>
          {title}
        </AppText>
        <AppText>{message}</AppText>
        <Button label="Sign in" icon="login" block testID={`${testID}-sign-in`} onPress={() => router.replace('/sign-in')} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  body: { gap: spacing.md },
});
