// Two projects: the server and engineering core on ts-jest in node; the app on jest-expo.
/** @type {import('jest').Config} */
module.exports = {
  projects: [
    {
      displayName: 'node',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/engineering', '<rootDir>/tests/server'],
      testMatch: ['**/*.test.ts'],
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
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
    },
    {
      displayName: 'app',
      preset: 'jest-expo/web',
      roots: ['<rootDir>/tests/components'],
      testMatch: ['**/*.test.tsx', '**/*.test.ts'],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.e2e.ts'],
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
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
    },
  ],
};
