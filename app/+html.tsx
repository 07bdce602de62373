import { ScrollViewStyleReset } from 'expo-router/html';
import type { PropsWithChildren } from 'react';

import { darkTheme, lightTheme } from '@/components/theme/tokens';

// The web document shell. Used when the web build renders pages ahead of time (`web.output`
// "static" or "server"); the single-page build uses public/index.html or Expo's default instead.
// No scripts and nothing fetched from another origin: only a style block for the first paint, so
// a dark-mode visitor never sees a white flash before the app draws.
const pageBackground = `
html, body { background-color: ${lightTheme.colors.background}; }
@media (prefers-color-scheme: dark) {
  html, body { background-color: ${darkTheme.colors.background}; }
}`;

export default function Root({ children }: PropsWithChildren) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover" />
        <meta name="color-scheme" content="light dark" />
        <meta name="theme-color" media="(prefers-color-scheme: light)" content={lightTheme.colors.background} />
        <meta name="theme-color" media="(prefers-color-scheme: dark)" content={darkTheme.colors.background} />
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: pageBackground }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
