// Devices load the icon font from the app bundle (see icon-font-file.web.ts for the browser).
// eslint-disable-next-line @typescript-eslint/no-require-imports -- Metro turns a require() of an asset into its module id; there is no import form for that.
export const iconFontFile: number | null = require('@expo/vector-icons/build/vendor/react-native-vector-icons/Fonts/MaterialCommunityIcons.ttf');
