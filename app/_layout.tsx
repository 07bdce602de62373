// First: lazy screens must find their shared chunk (see shared-chunk.web.ts).
import '@/components/common/shared-chunk';

import { QueryClientProvider } from '@tanstack/react-query';
import { Stack, ThemeProvider, type ErrorBoundaryProps } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useState } from 'react';
import { SafeAreaProvider } from 'react-native-safe-area-context';

import { OfflineNotice } from '@/components/navigation/offline-notice';
import { BootScreen, RouteErrorScreen, SessionErrorScreen } from '@/components/common/shell-states';
import { navigationThemeFor } from '@/components/theme/navigation-theme';
import { useTheme } from '@/components/theme/use-theme';
import { createQueryClient } from '@/hooks/query-client';
import { useAppFonts } from '@/hooks/use-app-fonts';
import { useSessionQuery } from '@/hooks/use-session';

export function ErrorBoundary({ retry }: ErrorBoundaryProps) {
  return <RouteErrorScreen onRetry={() => void retry()} />;
}

export default function RootLayout() {
  const [queryClient] = useState(createQueryClient);
  const theme = useTheme();
  // Bundled with the app and served from our own origin: no font is fetched from elsewhere. On
  // the web the fonts are declared in index.html and nothing waits for them.
  const [fontsLoaded, fontError] = useAppFonts();

  // A missing font falls back to the system face rather than blocking the app.
  if (!fontsLoaded && !fontError) return null;

  return (
    <SafeAreaProvider>
      <QueryClientProvider client={queryClient}>
        <ThemeProvider value={navigationThemeFor(theme)}>
          <StatusBar style={theme.scheme === 'dark' ? 'light' : 'dark'} />
          <OfflineNotice />
          <RootNavigator />
        </ThemeProvider>
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}

function RootNavigator() {
  const session = useSessionQuery();
  const { colors } = useTheme();

  // Keep showing the last known session while a refetch runs or fails; only the first load blocks.
  if (session.data === undefined) {
    return session.isError ? <SessionErrorScreen error={session.error} onRetry={() => void session.refetch()} retrying={session.isFetching} /> : <BootScreen />;
  }

  const signedIn = session.data.user !== null;
  return (
    <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: colors.background } }}>
      <Stack.Protected guard={signedIn}>
        <Stack.Screen name="(app)" />
      </Stack.Protected>
      <Stack.Protected guard={!signedIn}>
        <Stack.Screen name="(auth)" />
      </Stack.Protected>
      {/* A scanned label: open to everyone, the screen itself sends signed-out visitors to sign in. */}
      <Stack.Screen name="i/[tag]" />
      <Stack.Screen name="+not-found" />
    </Stack>
  );
}
