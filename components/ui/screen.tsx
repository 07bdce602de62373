import Head from 'expo-router/head';
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { SafeAreaView } from 'react-native-safe-area-context';

import { layout, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { AppText } from './app-text';

type ColumnWidth = 'form' | 'regular' | 'wide';

interface ScreenProps {
  /** `<name>-screen`; browser tests find screens by it. */
  testID: string;
  /** The screen's one h1, also the browser tab's title. */
  title: string;
  /** Set when the visible heading would repeat something already on screen (sign-in's mark). */
  hideTitle?: boolean;
  /** Content column cap: forms are narrow, tables wide, everything else regular. */
  width?: ColumnWidth;
  /** Centre the column vertically (sign-in, not found). */
  centered?: boolean;
  children: ReactNode;
}

const maxWidths: Record<ColumnWidth, number> = {
  form: layout.formMaxWidth,
  regular: layout.contentMaxWidth,
  wide: layout.wideContentMaxWidth,
};

export function Screen({ testID, title, hideTitle = false, width = 'regular', centered = false, children }: ScreenProps) {
  const { colors } = useTheme();
  return (
    // The screen's content is the page's one `main` landmark; navigation sits beside it in its own.
    <SafeAreaView edges={['top', 'left', 'right']} style={[styles.root, { backgroundColor: colors.background }]} testID={testID} role="main">
      <Head>
        <title>{`${title} · Voltcrib`}</title>
      </Head>
      <ScrollView style={styles.scroll} contentContainerStyle={[styles.scrollContent, centered && styles.centered]} keyboardShouldPersistTaps="handled">
        <View style={[styles.column, { maxWidth: maxWidths[width] }]}>
          {hideTitle ? null : (
            <AppText variant="title" headingLevel={1}>
              {title}
            </AppText>
          )}
          {children}
        </View>
      </ScrollView>
    </SafeAreaView>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  scroll: { flex: 1 },
  scrollContent: { flexGrow: 1, paddingHorizontal: spacing.md, paddingVertical: spacing.lg },
  centered: { justifyContent: 'center' },
  column: { width: '100%', alignSelf: 'center', gap: spacing.lg },
});
