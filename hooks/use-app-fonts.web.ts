// The browser: index.html preloads the WOFF2 fonts the web build made (scripts/lib/web-fonts.ts)
// and declares them with `font-display: swap`, so the app draws at once and never waits for a
// font; the text fonts ship with the app, nothing is fetched from another origin.
export function useAppFonts(): [boolean, Error | null] {
  return [true, null];
}
