// Devices load the icon font from the app bundle (see icon-font-file.web.ts for the browser).
export const iconFontFile: number | null = require('@expo/vector-icons/build/vendor/react-native-vector-icons/Fonts/MaterialCommunityIcons.ttf');
