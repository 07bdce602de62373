// Expo's Metro defaults plus resolver overrides for zod, because Metro does not tree-shake and
// zod's index re-exports parts the app never runs, all of which would ship on the first page:
// - `locales/index`: every locale, ~270 KB of messages nobody reads. The app only speaks English;
//   zod's schemas import `locales/en` directly, so nothing else is lost.
// - `core/compile.js` (z.compile, ~30 KB minified) and `classic/from-json-schema.js`
//   (z.fromJSONSchema, ~12 KB): nothing in the app calls them, and zod's own parsing never does;
//   the stand-ins throw if anything ever does. The server (plain Node) keeps the real modules.
// And for react-native-web: packages compiled to CommonJS (expo-router among them) read
// `require('react-native')` as one object, which pulls every react-native-web export into the
// first download. The components below are rendered by nothing in the app or those packages, so
// react-native-web's own index (and its Animated wrappers) get a stand-in that throws if rendered;
// our code importing one of them directly still gets the real component.
// Likewise expo-router's index re-exports parts the app never runs (route sitemap, header search
// bar, iOS link previews, React Navigation's static configuration API): they get a stand-in that
// throws if ever called (metro/expo-router-left-out.js).
const path = require('path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);

const ZOD_LOCALES_INDEX = /^\.\.\/locales\/index\.c?js$/;
const INSIDE_ZOD = /[\\/]node_modules[\\/]zod[\\/]/;
const englishOnlyLocales = path.resolve(__dirname, 'metro/zod-locales-en.js');
const LEFT_OUT = [
  { request: /^\.\/compile\.c?js$/, from: /[\\/]zod[\\/]v4[\\/]core[\\/]index\.c?js$/, file: path.resolve(__dirname, 'metro/zod-compile-left-out.js') },
  {
    request: /^\.\/from-json-schema\.c?js$/,
    from: /[\\/]zod[\\/]v4[\\/]classic[\\/]external\.c?js$/,
    file: path.resolve(__dirname, 'metro/zod-from-json-schema-left-out.js'),
  },
];

const RN_WEB_LEFT_OUT = [
  'FlatList',
  'SectionList',
  'VirtualizedList',
  'Modal',
  'CheckBox',
  'Switch',
  'Picker',
  'ProgressBar',
  'Touchable',
  'TouchableHighlight',
  'TouchableWithoutFeedback',
  'TouchableNativeFeedback',
  'ImageBackground',
  'KeyboardAvoidingView',
  'RefreshControl',
  'PanResponder',
  'YellowBox',
  'InputAccessoryView',
];
const RN_WEB_EXPORT = new RegExp(`[\\\\/]react-native-web[\\\\/]dist[\\\\/]exports[\\\\/](${RN_WEB_LEFT_OUT.join('|')})[\\\\/]index\\.js$`);
const INSIDE_RN_WEB = /[\\/]node_modules[\\/]react-native-web[\\/]/;
const rnWebLeftOut = path.resolve(__dirname, 'metro/rn-web-left-out.js');

const ROUTER_LEFT_OUT = [
  'views/Sitemap',
  'react-navigation/elements/Header/HeaderSearchBar',
  'link/preview/HrefPreview',
  'link/LinkWithPreview',
  'react-navigation/core/StaticNavigation',
  'react-navigation/native/createStaticNavigation',
];
const ROUTER_EXPORT = new RegExp(`[\\\\/]expo-router[\\\\/]build[\\\\/](${ROUTER_LEFT_OUT.join('|')})\\.js$`);
const routerLeftOut = path.resolve(__dirname, 'metro/expo-router-left-out.js');

const upstreamResolveRequest = config.resolver.resolveRequest;

config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (ZOD_LOCALES_INDEX.test(moduleName) && INSIDE_ZOD.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: englishOnlyLocales };
  }
  const leftOut = LEFT_OUT.find((entry) => entry.request.test(moduleName) && entry.from.test(context.originModulePath));
  if (leftOut) return { type: 'sourceFile', filePath: leftOut.file };
  const resolved = (upstreamResolveRequest ?? context.resolveRequest)(context, moduleName, platform);
  if (platform === 'web' && resolved.type === 'sourceFile' && INSIDE_RN_WEB.test(context.originModulePath) && RN_WEB_EXPORT.test(resolved.filePath)) {
    return { type: 'sourceFile', filePath: rnWebLeftOut };
  }
  if (platform === 'web' && resolved.type === 'sourceFile' && ROUTER_EXPORT.test(resolved.filePath)) {
    return { type: 'sourceFile', filePath: routerLeftOut };
  }
  return resolved;
};

module.exports = config;
