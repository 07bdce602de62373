// The web app's fonts, made when the web app is built: the two Atkinson Hyperlegible text weights
// converted to WOFF2, and an icon font cut down to the glyphs listed in components/ui/icon.tsx.
// Each file is named by a hash of its bytes, so the server can let browsers keep it for a year,
// and index.html preloads them and declares them with `font-display: swap` (text shows at once in
// the fallback face and never waits for a font).
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import subsetFont from 'subset-font';
import ts from 'typescript';

const ROOT = path.resolve(__dirname, '..', '..');
export const ICON_SOURCE = path.join(ROOT, 'components', 'ui', 'icon.tsx');
const VECTOR_ICONS = path.join(ROOT, 'node_modules', '@expo', 'vector-icons', 'build', 'vendor', 'react-native-vector-icons');
const ICON_TTF = path.join(VECTOR_ICONS, 'Fonts', 'MaterialCommunityIcons.ttf');
const ICON_GLYPHMAP = path.join(VECTOR_ICONS, 'glyphmaps', 'MaterialCommunityIcons.json');
const ATKINSON = path.join(ROOT, 'node_modules', '@expo-google-fonts', 'atkinson-hyperlegible');

/** The CSS family names the app's styles use (tokens.ts for text, icon.tsx for icons). */
const TEXT_FONTS = [
  { family: 'AtkinsonHyperlegible_400Regular', file: path.join(ATKINSON, '400Regular', 'AtkinsonHyperlegible_400Regular.ttf') },
  { family: 'AtkinsonHyperlegible_700Bold', file: path.join(ATKINSON, '700Bold', 'AtkinsonHyperlegible_700Bold.ttf') },
];
export const ICON_FAMILY = 'material-community';

export interface Glyph {
  name: string;
  codepoint: number;
}

/**
 * Reads the `glyphs` object literal of icon.tsx with the TypeScript parser, so the list in that
 * file stays the only place an icon is named.
 */
export function iconGlyphs(source = readFileSync(ICON_SOURCE, 'utf8')): Glyph[] {
  const file = ts.createSourceFile('icon.tsx', source, ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
  let literal: ts.ObjectLiteralExpression | undefined;
  const visit = (node: ts.Node) => {
    if (ts.isVariableDeclaration(node) && ts.isIdentifier(node.name) && node.name.text === 'glyphs' && node.initializer) {
      let init: ts.Expression = node.initializer;
      while (ts.isAsExpression(init) || ts.isSatisfiesExpression(init) || ts.isParenthesizedExpression(init)) init = init.expression;
      if (ts.isObjectLiteralExpression(init)) literal = init;
    }
    ts.forEachChild(node, visit);
  };
  visit(file);
  if (!literal) throw new Error('components/ui/icon.tsx: no `const glyphs = { … }` object found');
  return literal.properties.map((property) => {
    if (!ts.isPropertyAssignment(property) || !ts.isNumericLiteral(property.initializer)) {
      throw new Error(`components/ui/icon.tsx: every glyph is written \`name: 0x…\` (found \`${property.getText()}\`)`);
    }
    const name = ts.isStringLiteral(property.name) || ts.isIdentifier(property.name) ? property.name.text : property.name.getText();
    return { name, codepoint: Number(property.initializer.text) };
  });
}

/** A glyph whose codepoint is not the set's codepoint for that name would draw the wrong icon. */
export function checkGlyphs(glyphs: Glyph[], glyphmap: Record<string, number> = JSON.parse(readFileSync(ICON_GLYPHMAP, 'utf8'))): void {
  const wrong = glyphs.filter((g) => glyphmap[g.name] !== g.codepoint);
  if (wrong.length > 0) {
    const lines = wrong.map(
      (g) =>
        `  ${g.name}: 0x${g.codepoint.toString(16)} (the set has ${glyphmap[g.name] === undefined ? 'no such icon' : `0x${glyphmap[g.name]!.toString(16)}`})`,
    );
    throw new Error(`components/ui/icon.tsx lists icons the font does not have under those codes:\n${lines.join('\n')}`);
  }
}

export interface BuiltFont {
  family: string;
  /** Path under the web root, e.g. /fonts/icons.1a2b3c4d.woff2 */
  href: string;
  bytes: number;
  /** Text fonts are preloaded; the icon font too, since icons sit beside the first screen's words. */
  preload: boolean;
}

function writeHashed(dir: string, stem: string, bytes: Buffer): string {
  const hash = createHash('sha256').update(bytes).digest('hex').slice(0, 16);
  const name = `${stem}.${hash}.woff2`;
  writeFileSync(path.join(dir, name), bytes);
  return `/fonts/${name}`;
}

/** Writes the WOFF2 files into <webDir>/fonts and returns what index.html must declare. */
export async function buildWebFonts(webDir: string): Promise<BuiltFont[]> {
  const dir = path.join(webDir, 'fonts');
  mkdirSync(dir, { recursive: true });
  const glyphs = iconGlyphs();
  checkGlyphs(glyphs);
  const built: BuiltFont[] = [];
  for (const font of TEXT_FONTS) {
    const woff2 = await subsetFont(readFileSync(font.file), undefined, { targetFormat: 'woff2', keepAllGlyphs: true });
    built.push({ family: font.family, href: writeHashed(dir, font.family, woff2), bytes: woff2.length, preload: true });
  }
  const iconText = String.fromCodePoint(...glyphs.map((g) => g.codepoint));
  const icons = await subsetFont(readFileSync(ICON_TTF), iconText, { targetFormat: 'woff2' });
  built.push({ family: ICON_FAMILY, href: writeHashed(dir, 'icons', icons), bytes: icons.length, preload: true });
  return built;
}

/** The <head> additions: preload links and @font-face rules. */
export function fontHeadHtml(fonts: BuiltFont[]): string {
  const preloads = fonts.filter((f) => f.preload).map((f) => `<link rel="preload" href="${f.href}" as="font" type="font/woff2" crossorigin>`);
  const faces = fonts.map((f) => `@font-face{font-family:${JSON.stringify(f.family)};src:url(${f.href}) format("woff2");font-display:swap}`);
  return `${preloads.join('\n')}\n<style id="voltcrib-fonts">${faces.join('')}</style>\n`;
}
