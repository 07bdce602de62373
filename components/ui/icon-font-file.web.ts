// The browser gets the icon font from index.html: the web build cuts it to the glyphs the app
// lists (scripts/lib/web-fonts.ts) and preloads it, so the full font is never in the web export.
export const iconFontFile: number | null = null;
