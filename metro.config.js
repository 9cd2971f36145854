// Expo's own Metro set-up, with changes for the web bundle. First, zod's locale index (every language it
// ships, some 330 kB) is swapped for a module that has English only. The app never picks another
// locale, and English is the one zod registers by default (zod/v4/classic/schemas.js imports
// ../locales/en.js itself), so every message reads exactly as before. The server runs zod from
// node_modules under Node, not through Metro, and is unaffected.
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);

const zodLocalesIndex = /^\.\.\/locales\/index\.c?js$/;
const insideZodV4 = /[\\/]node_modules[\\/]zod[\\/]v4[\\/](classic|core|mini)[\\/]/;
const englishOnly = path.join(__dirname, 'metro.zod-locales.js');

// Async routes (app.json) split every page of app/ into its own chunk; on the web the route context is
// ours (metro.router-ctx.js, in place of expo-router's own), which bundles the layouts with the entry.
const routerCtx = path.join(__dirname, 'metro.router-ctx.js');

// Two more of zod's modules that the app never calls, swapped on the web for modules of the same names
// that throw when called: `z.compile` (generated parsers; the app parses jitless, index.ts) and
// `z.fromJSONSchema` (the schemas are written in db/contracts). Together some 40 kB of script that every
// page would otherwise load at start. Only these two imports, from zod's own index modules.
const zodLeftOut = {
  './compile.js': {
    from: /[\\/]node_modules[\\/]zod[\\/]v4[\\/]core[\\/]index\.js$/,
    to: path.join(__dirname, 'lib', 'zod-web', 'compile.ts'),
  },
  './from-json-schema.js': {
    from: /[\\/]node_modules[\\/]zod[\\/]v4[\\/]classic[\\/]external\.js$/,
    to: path.join(__dirname, 'lib', 'zod-web', 'from-json-schema.ts'),
  },
};

const upstream = config.resolver.resolveRequest;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (platform === 'web' && zodLocalesIndex.test(moduleName) && insideZodV4.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: englishOnly };
  }
  const leftOut = platform === 'web' && Object.hasOwn(zodLeftOut, moduleName) ? zodLeftOut[moduleName] : null;
  if (leftOut && leftOut.from.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: leftOut.to };
  }
  if (platform === 'web' && moduleName === 'expo-router/_ctx') {
    return { type: 'sourceFile', filePath: routerCtx };
  }
  return upstream ? upstream(context, moduleName, platform) : context.resolveRequest(context, moduleName, platform);
};

module.exports = config;
