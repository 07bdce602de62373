// Expo's Metro defaults plus one resolver override: zod 4 re-exports every locale from
// `locales/index`, and Metro does not tree-shake, so ~270 KB of messages nobody reads would ship.
// The app only speaks English; zod's schemas import `locales/en` directly, so nothing else is lost.
const path = require('path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);

const ZOD_LOCALES_INDEX = /^\.\.\/locales\/index\.c?js$/;
const INSIDE_ZOD = /[\\/]node_modules[\\/]zod[\\/]/;
const englishOnlyLocales = path.resolve(__dirname, 'metro/zod-locales-en.js');

const upstreamResolveRequest = config.resolver.resolveRequest;

config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (ZOD_LOCALES_INDEX.test(moduleName) && INSIDE_ZOD.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: englishOnlyLocales };
  }
  return (upstreamResolveRequest ?? context.resolveRequest)(context, moduleName, platform);
};

module.exports = config;
