// Expo Router's route context on the web (metro.config.js puts it in place of expo-router/_ctx): every
// file of app/ loaded when first opened (async routes, app.json), as expo-router's own context does,
// with one thing known up front: each layout's `unstable_settings`. expo-router reads a layout's
// initialRouteName while it builds the route tree, before any layout has loaded, so with lazy layouts
// alone a signed-out visit would open the first page of (auth) by name (forgot), not sign-in.
// metro.config.js reads the settings from the layouts' source into the JSON below at every bundling.
// Written by metro.config.js when bundling starts, so not there yet on a fresh clone when lint runs
// (eslint.config.js lets import/no-unresolved pass this one file).
import settings from './node_modules/.cache/pitchcard/router-layouts.json';

// The same files as expo-router/_ctx.web.js: every route and layout, not +api, +middleware, +html.
const routes = require.context(
  './app',
  true,
  /^(?:\.\/)(?!(?:(?:(?:.*\+api)|(?:\+middleware)|(?:\+(html|native-intent))))\.[tj]sx?$).*(?:\.android|\.ios|\.native)?\.[tj]sx?$/,
  'lazy',
);

function load(key) {
  const loading = routes(key);
  // A layout still loading is a thenable; expo-router reads the settings off what it is handed.
  if (settings[key] && loading && typeof loading.then === 'function' && loading.unstable_settings === undefined) {
    loading.unstable_settings = settings[key];
  }
  return loading;
}
load.keys = () => routes.keys();
load.resolve = (key) => routes.resolve(key);
load.id = routes.id;

export const ctx = load;
