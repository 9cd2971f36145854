// Three projects: the server and engineering core on ts-jest in node; the app on jest-expo; the browser
// tests (e2e) on ts-jest in node as well.
const moduleNameMapper = { '^@/(.*)$': '<rootDir>/$1' };

/** TypeScript run in node, compiled file by file to CommonJS by ts-jest: the server's tests and the browser's. */
const tsInNode = {
  testEnvironment: 'node',
  transform: {
    '^.+\\.ts$': [
      'ts-jest',
      {
        tsconfig: {
          module: 'commonjs',
          esModuleInterop: true,
          strict: true,
          skipLibCheck: true,
          target: 'es2022',
          isolatedModules: true,
        },
      },
    ],
  },
  moduleNameMapper,
};

/** @type {import('jest').Config} */
module.exports = {
  // A test's own limit where it sets none: jsdom tests that take half a second alone took over five on a
  // loaded two-core CI machine. A file that needs longer says so itself (jest.setTimeout).
  testTimeout: 20_000,
  projects: [
    {
      displayName: 'node',
      ...tsInNode,
      roots: ['<rootDir>/tests/engineering', '<rootDir>/tests/server'],
      testMatch: ['**/*.test.ts'],
    },
    {
      displayName: 'app',
      preset: 'jest-expo/web',
      roots: ['<rootDir>/tests/components'],
      testMatch: ['**/*.test.tsx', '**/*.test.ts'],
      moduleNameMapper,
    },
    {
      displayName: 'e2e',
      ...tsInNode,
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.e2e.ts'],
    },
  ],
};
