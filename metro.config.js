// Expo's own Metro set-up, with changes for the web bundle. First, zod's locale index (every language it
// ships, some 330 kB) is swapped for a module that has English only. The app never picks another
// locale, and English is the one zod registers by default (zod/v4/classic/schemas.js imports
// ../locales/en.js itself), so every message reads exactly as before. The server runs zod from
// node_modules under Node, not through Metro, and is unaffected.
const fs = require('node:fs');
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);

const zodLocalesIndex = /^\.\.\/locales\/index\.c?js$/;
const insideZodV4 = /[\\/]node_modules[\\/]zod[\\/]v4[\\/](classic|core|mini)[\\/]/;
const englishOnly = path.join(__dirname, 'metro.zod-locales.js');

// Async routes (app.json) load every file of app/ when first opened, layouts too; expo-router reads a
// layout's `unstable_settings` (initialRouteName) while building the route tree, before it is loaded.
// So the settings are read here from the layouts' source, into a JSON file that the web's route context
// (metro.router-ctx.js, in place of expo-router's own) hands to expo-router. Only the plain form
// `export const unstable_settings = { initialRouteName: '…' };` (or anchor) is understood; any other
// form stops the bundling rather than be silently ignored.
const appDir = path.join(__dirname, 'app');
const routerCtx = path.join(__dirname, 'metro.router-ctx.js');
function layoutSettings() {
  const found = {};
  const walk = (dir) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(p);
      else if (/^_layout\.[tj]sx?$/.test(entry.name)) {
        const source = fs.readFileSync(p, 'utf8');
        if (!/\bunstable_settings\b/.test(source)) continue;
        const plain =
          /export\s+const\s+unstable_settings\s*=\s*\{\s*(initialRouteName|anchor)\s*:\s*(['"])([^'"]+)\2\s*,?\s*\}\s*;/.exec(
            source,
          );
        if (!plain)
          throw new Error(
            `${path.relative(__dirname, p)}: write unstable_settings as { initialRouteName: '…' } (metro.config.js reads it from the source for async routes)`,
          );
        found[`./${path.relative(appDir, p).split(path.sep).join('/')}`] = { [plain[1]]: plain[3] };
      }
    }
  };
  walk(appDir);
  return found;
}
const settingsFile = path.join(__dirname, 'node_modules', '.cache', 'pitchcard', 'router-layouts.json');
fs.mkdirSync(path.dirname(settingsFile), { recursive: true });
const settingsJson = JSON.stringify(layoutSettings(), null, 2);
if (!fs.existsSync(settingsFile) || fs.readFileSync(settingsFile, 'utf8') !== settingsJson)
  fs.writeFileSync(settingsFile, settingsJson);

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
