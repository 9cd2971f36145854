// ESLint with Expo's own rules (flat config) over the whole project; Prettier (.prettierrc.json) owns the
// layout, so nothing here is about formatting. Both run in `npm test` (scripts/test.sh).
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');

module.exports = defineConfig([
  expoConfig,
  {
    // The React Compiler is not on (app.json has no `reactCompiler`): these two rules judge components by
    // what it could memoise. The places they name (a ref read while drawing, a state set from an effect)
    // work as written today; they are listed as warnings, to rework one by one, not as errors.
    rules: { 'react-hooks/refs': 'warn', 'react-hooks/set-state-in-effect': 'warn' },
  },
  {
    // Generated or installed, never written by hand.
    ignores: [
      'dist/**',
      'build/**',
      '.cache/**',
      '.expo/**',
      '.pgdata/**',
      'uploads/**',
      'public/**',
      'db/migrations/**',
      'coverage/**',
    ],
  },
]);
