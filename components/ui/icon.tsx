import { Text } from 'react-native';

import { iconSizes } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';

import { iconFontFile } from './icon-font-file';

// Voltcrib draws every icon from one set, Material Design Icons (the font bundled with
// @expo/vector-icons). Only the glyphs below reach the app: the web build cuts the font down to
// exactly these (scripts/lib/web-fonts.ts reads this object), so the browser gets a few KB
// instead of the whole 1.3 MB set, and a closed list keeps the visual vocabulary deliberate.
// To add an icon, add its line here: copy its codepoint from
// node_modules/@expo/vector-icons/build/vendor/react-native-vector-icons/glyphmaps/MaterialCommunityIcons.json
// (the build checks every name against that map and stops on a wrong code).
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
  // Booking, release and return (bookings work).
  'arrow-left': 0xf004d,
  'calendar-plus': 0xf00f3,
  cancel: 0xf073a,
  'check-circle': 0xf05e0,
  'checkbox-blank-outline': 0xf0131,
  'checkbox-marked': 0xf0132,
  // Choice chips: a radio dot says which is chosen (the look module's chip shape).
  'radiobox-blank': 0xf043d,
  'radiobox-marked': 0xf043e,
  'chevron-down': 0xf0140,
  'chevron-up': 0xf0143,
  'clock-alert': 0xf0955,
  'clock-outline': 0xf0150,
  close: 0xf0156,
  'close-circle': 0xf0159,
  'database-check': 0xf0aa9,
  'keyboard-return': 0xf0311,
  'lock-open-variant': 0xf0fc6,
  magnify: 0xf0349,
  'package-variant-closed': 0xf03d7,
  pencil: 0xf03eb,
  plus: 0xf0415,
  'timer-sand': 0xf051f,
  // Gear registry, scanning and labels (gear work).
  archive: 0xf003c,
  'calendar-alert': 0xf0a31,
  'calendar-clock': 0xf00f0,
  camera: 0xf0100,
  'camera-off': 0xf05df,
  'file-document': 0xf0219,
  'filter-variant': 0xf0236,
  'help-circle': 0xf02d7,
  image: 0xf02e9,
  'map-marker': 0xf034e,
  'open-in-new': 0xf03cc,
  printer: 0xf042a,
  'tag-off': 0xf1220,
  upload: 0xf0552,
  wrench: 0xf05b7,
} as const;

// The family name the web build's @font-face rule and the native font registration share.
const FONT_FAMILY = 'material-community';

export type IconName = keyof typeof glyphs;

/**
 * Pass to useFonts on devices. On the web it is empty: the build declares and preloads the cut
 * font in index.html, so nothing waits for it.
 */
export const iconFont: Record<string, number> = iconFontFile === null ? {} : { [FONT_FAMILY]: iconFontFile };

interface IconProps {
  name: IconName;
  size?: number;
  color?: string;
}

/** A decorative icon: always beside a word, so assistive tech skips it. */
export function Icon({ name, size = iconSizes.md, color }: IconProps) {
  const { colors } = useTheme();
  return (
    <Text
      selectable={false}
      aria-hidden
      importantForAccessibility="no-hide-descendants"
      // A fixed square box: the glyph may arrive a moment after the words (font-display: swap),
      // and nothing beside it moves when it does.
      style={{
        fontFamily: FONT_FAMILY,
        fontSize: size,
        lineHeight: size,
        width: size,
        height: size,
        textAlign: 'center',
        color: color ?? colors.text,
        fontWeight: 'normal',
        fontStyle: 'normal',
      }}
    >
      {String.fromCodePoint(glyphs[name])}
    </Text>
  );
}
