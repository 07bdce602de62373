// Voltcrib's one source of colours, sizes and type. Nothing else in the app writes a colour or a
// size literal: screens and primitives read these by semantic name.
//
// Identity: "bench tag". Ink and paper, like the printed tags on a cable or an HV enclosure:
// controls are ink on paper (paper on ink in the dark), tonal fills are neutral greys, and the one
// brand colour, corona violet (the glow of a corona discharge), marks only where you are: the
// navigation rail. Violet is deliberately not one of the safety colours, so brand and hazard never
// blur. Shapes (see `shapes`): cards are squared tags with a heavy top rule instead of a rounded
// outline; chips are squared tags with a radio dot; the current place in the navigation is a rail
// along the item's edge, never a pill behind the icon. The mark: a V held in a square crib over an
// earth bar (components/ui/voltcrib-mark.tsx).
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
  /** The navigation rail marking the current place: the brand colour, and nothing else uses it. */
  rail: string;
  /**
   * States that matter at a glance (free / already booked, approved / awaiting, overdue). Each is
   * a tint with an edge in the hue family of its safety meaning, and always comes with a word and
   * an icon (Badge tones 'ok', 'held', 'late').
   */
  state: Record<'ok' | 'held' | 'late', { fill: string; text: string; edge: string }>;
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
    primary: ink[900],
    onPrimary: ink[0],
    primarySoft: ink[100],
    onPrimarySoft: ink[900],
    border: ink[200],
    borderStrong: ink[500],
    focus: violet.main,
    rail: violet.main,
    state: {
      ok: { fill: '#E3F2E8', text: '#0B4D28', edge: safety.green },
      held: { fill: '#FDEBDD', text: '#6E2A00', edge: '#9A3B00' },
      late: { fill: '#FBE3E6', text: '#7A0A1C', edge: safety.red },
    },
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
    primary: '#F4F4F7',
    onPrimary: ink[900],
    primarySoft: ink[700],
    onPrimarySoft: '#F4F4F7',
    border: ink[600],
    borderStrong: ink[400],
    focus: violet.light,
    rail: violet.light,
    state: {
      ok: { fill: '#12301F', text: '#B6EBC8', edge: '#3DBA6E' },
      held: { fill: '#3A2212', text: '#FFD2B0', edge: safety.orange },
      late: { fill: '#3D1218', text: '#FFC2C9', edge: safety.redBright },
    },
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

/** Voltcrib's own shapes, read by the primitives (Card, ChoiceChips, Badge, the navigation). */
export const shapes = {
  /** Cards: a squared tag with a heavy rule along the top edge, no outline. */
  cardRadius: 4,
  cardRule: 4,
  /** Chips and badges: squared tags, not pills. */
  chipRadius: 4,
  /** The rail beside (side nav) or above (tab bar) the current place. */
  railThickness: 4,
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
