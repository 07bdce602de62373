// Voltcrib's one source of colours, sizes and type. Nothing else in the app writes a colour or a
// size literal: screens and primitives read these by semantic name.
//
// Identity: "corona violet" (the glow of a corona discharge) on ink and paper, with the mark —
// a V held in a square crib over an earth bar (see components/ui/voltcrib-mark.tsx).
// Violet is deliberately not one of the safety colours, so brand and hazard never blur.
//
// Hazard colours follow the ANSI Z535 / ISO 3864 safety-colour meanings: red danger,
// orange warning, yellow caution, green safe condition, blue information. Foregrounds follow the
// same convention (white on red, green and blue; black on orange and yellow). Every pair below
// was checked for at least 4.5:1 text contrast; in dark mode the fills also keep 3:1 against the
// page so a badge's shape stays visible in a dimmed lab.

export type HazardLevel = 'danger' | 'warning' | 'caution' | 'safe' | 'info';

interface HazardColors {
  /** The safety colour itself. */
  fill: string;
  /** Text and icon drawn on `fill`. */
  onFill: string;
  /** Outline, so a pale fill (yellow) still has an edge on a pale page. */
  edge: string;
}

export interface ThemeColors {
  background: string;
  surface: string;
  surfaceMuted: string;
  text: string;
  textMuted: string;
  primary: string;
  onPrimary: string;
  primarySoft: string;
  onPrimarySoft: string;
  border: string;
  borderStrong: string;
  focus: string;
  /** Inline error text on `surface` or `background` (field errors, failed loads). */
  errorText: string;
  /** Destructive buttons; the same red as the danger hazard so "destroys something" reads alike. */
  danger: string;
  onDanger: string;
  scrim: string;
  hazard: Record<HazardLevel, HazardColors>;
}

export interface Theme {
  scheme: 'light' | 'dark';
  colors: ThemeColors;
}

const ink = {
  900: '#0E0F13',
  800: '#191B22',
  700: '#242731',
  600: '#3A3E4A',
  500: '#6B7080',
  400: '#8A8FA0',
  300: '#B8BCC8',
  200: '#D5D7DE',
  100: '#ECEDF1',
  50: '#F4F4F6',
  0: '#FFFFFF',
};

const violet = {
  deep: '#2A1570',
  main: '#4B2BB3',
  soft: '#ECE8FB',
  light: '#B9A8FF',
  night: '#2D2356',
  onLight: '#14082E',
};

const safety = {
  red: '#C8102E',
  redBright: '#D7263D',
  orange: '#F26B1D',
  yellow: '#FFD100',
  yellowEdge: '#7A6200',
  green: '#00813D',
  blue: '#0057B8',
  blueBright: '#2E74C8',
  black: '#111111',
  white: '#FFFFFF',
};

export const lightTheme: Theme = {
  scheme: 'light',
  colors: {
    background: ink[50],
    surface: ink[0],
    surfaceMuted: ink[100],
    text: ink[900],
    textMuted: '#4A4F5C',
    primary: violet.main,
    onPrimary: ink[0],
    primarySoft: violet.soft,
    onPrimarySoft: violet.deep,
    border: ink[200],
    borderStrong: ink[500],
    focus: ink[900],
    errorText: '#B3261E',
    danger: safety.red,
    onDanger: safety.white,
    scrim: 'rgba(14, 15, 19, 0.45)',
    hazard: {
      danger: { fill: safety.red, onFill: safety.white, edge: safety.red },
      warning: { fill: safety.orange, onFill: safety.black, edge: '#9A3B00' },
      caution: { fill: safety.yellow, onFill: safety.black, edge: safety.yellowEdge },
      safe: { fill: safety.green, onFill: safety.white, edge: safety.green },
      info: { fill: safety.blue, onFill: safety.white, edge: safety.blue },
    },
  },
};

export const darkTheme: Theme = {
  scheme: 'dark',
  colors: {
    background: ink[900],
    surface: ink[800],
    surfaceMuted: ink[700],
    text: '#F4F4F7',
    textMuted: ink[300],
    primary: violet.light,
    onPrimary: violet.onLight,
    primarySoft: violet.night,
    onPrimarySoft: '#E4DCFF',
    border: ink[600],
    borderStrong: ink[400],
    focus: ink[0],
    errorText: '#FF8A80',
    danger: safety.redBright,
    onDanger: safety.white,
    scrim: 'rgba(0, 0, 0, 0.6)',
    hazard: {
      danger: { fill: safety.redBright, onFill: safety.white, edge: safety.redBright },
      warning: { fill: safety.orange, onFill: safety.black, edge: safety.orange },
      caution: { fill: safety.yellow, onFill: safety.black, edge: safety.yellow },
      safe: { fill: safety.green, onFill: safety.white, edge: safety.green },
      info: { fill: safety.blueBright, onFill: safety.white, edge: safety.blueBright },
    },
  },
};

/** Every hazard level carries a word and an icon as well as its colour, never colour alone. */
export const hazardLevels: Record<HazardLevel, { word: string; icon: 'alert-octagon' | 'alert' | 'alert-circle' | 'shield-check' | 'information' }> = {
  danger: { word: 'Danger', icon: 'alert-octagon' },
  warning: { word: 'Warning', icon: 'alert' },
  caution: { word: 'Caution', icon: 'alert-circle' },
  safe: { word: 'Safe', icon: 'shield-check' },
  info: { word: 'Information', icon: 'information' },
};

export const spacing = {
  xxs: 4,
  xs: 8,
  sm: 12,
  md: 16,
  lg: 24,
  xl: 32,
  xxl: 48,
} as const;

export const fontFamilies = {
  regular: 'AtkinsonHyperlegible_400Regular',
  bold: 'AtkinsonHyperlegible_700Bold',
} as const;

// Sized for reading at arm's length on a bench: nothing below 16 px, body at 18 px.
export const typeScale = {
  display: { fontSize: 34, lineHeight: 42, family: fontFamilies.bold },
  title: { fontSize: 28, lineHeight: 36, family: fontFamilies.bold },
  heading: { fontSize: 22, lineHeight: 30, family: fontFamilies.bold },
  body: { fontSize: 18, lineHeight: 28, family: fontFamilies.regular },
  bodyStrong: { fontSize: 18, lineHeight: 28, family: fontFamilies.bold },
  label: { fontSize: 18, lineHeight: 24, family: fontFamilies.bold },
  small: { fontSize: 16, lineHeight: 22, family: fontFamilies.regular },
  smallStrong: { fontSize: 16, lineHeight: 22, family: fontFamilies.bold },
} as const;

export type TextVariant = keyof typeof typeScale;

export const iconSizes = {
  sm: 18,
  md: 24,
  lg: 40,
} as const;

export const radii = {
  sm: 6,
  md: 10,
  lg: 16,
  pill: 999,
} as const;

export const borders = {
  hairline: 1,
  control: 2,
  focusRing: 3,
} as const;

export const breakpoints = {
  /** At and above this width the app shows side navigation and wide layouts (tables). */
  wide: 900,
} as const;

export const layout = {
  /** Gloved, one-handed use at a counter: nothing pressable is smaller than this. */
  minTouchTarget: 48,
  tabBarItemHeight: 64,
  sideNavWidth: 272,
  /** Content column caps, so lines stay readable on a wide screen. */
  contentMaxWidth: 760,
  wideContentMaxWidth: 1120,
  formMaxWidth: 480,
  badgeMinHeight: 36,
  listRowMinHeight: 64,
  markSize: 40,
  markSizeLarge: 72,
} as const;
