// What zod's `locales` namespace holds in the web bundle (metro.config.js points zod's locale index
// here): English only, the very module zod itself registers as its default, so it is not bundled twice.
export { default as en } from 'zod/v4/locales/en.js';
