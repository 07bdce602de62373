import createIconSet from '@expo/vector-icons/createIconSet';

import { iconSizes } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

// Voltcrib draws every icon from one set, Material Design Icons (the font bundled with
// @expo/vector-icons). Only the glyphs below are in the app: the set's full name-to-codepoint map
// would add ~186 KB (~50 KB gzipped) to the web bundle, and a closed list keeps the visual
// vocabulary deliberate. To add an icon, copy its codepoint from
// node_modules/@expo/vector-icons/build/vendor/react-native-vector-icons/glyphmaps/MaterialCommunityIcons.json
const glyphs = {
  account: 0xf0004,
  'account-check': 0xf0008,
  'account-circle': 0xf0009,
  'account-group': 0xf0849,
  'account-off': 0xf0012,
  alert: 0xf0026,
  'alert-circle': 0xf0028,
  'alert-circle-outline': 0xf05d6,
  'alert-octagon': 0xf0029,
  'badge-account': 0xf0da7,
  'book-cog': 0xf168a,
  'calculator-variant': 0xf0a9a,
  'calendar-check': 0xf00ef,
  'chart-bar': 0xf0128,
  'chevron-right': 0xf0142,
  'clipboard-check': 0xf014e,
  'dots-horizontal': 0xf01d8,
  'email-fast': 0xf186f,
  history: 0xf02da,
  'home-lightning-bolt': 0xf1903,
  information: 0xf02fc,
  'label-multiple': 0xf1375,
  login: 0xf0342,
  logout: 0xf0343,
  'map-marker-question': 0xf0f07,
  'qrcode-scan': 0xf0433,
  refresh: 0xf0450,
  'shield-check': 0xf0565,
  tools: 0xf1064,
  tray: 0xf1294,
} as const;

// The font is the one @expo/vector-icons/MaterialCommunityIcons ships; same family name, so it is
// loaded once whichever module asks for it.
const FONT_FAMILY = 'material-community';
// A font asset: Metro resolves the require to a URL on the web and a bundled file on devices.
const fontFile = require('@expo/vector-icons/build/vendor/react-native-vector-icons/Fonts/MaterialCommunityIcons.ttf');

const IconSet = createIconSet(glyphs, FONT_FAMILY, fontFile);

export type IconName = keyof typeof glyphs;

/** Pass to useFonts in the root layout so icons draw on first paint. */
export const iconFont = IconSet.font;

interface IconProps {
  name: IconName;
  size?: number;
  color?: string;
}

/** A decorative icon: always beside a word, so assistive tech skips it. */
export function Icon({ name, size = iconSizes.md, color }: IconProps) {
  const { colors } = useTheme();
  return (
    <IconSet
      name={name}
      size={size}
      color={color ?? colors.text}
      aria-hidden
      importantForAccessibility="no-hide-descendants"
    />
  );
}

