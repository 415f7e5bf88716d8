// One runner for the whole repository (see DEVELOPERS.md): each project below is one layer.
// The time limit fits the real work of the slowest layers on a 2-core machine that is busy with other
// jobs (Argon2id hashes and MariaDB round trips in api, a browser in e2e); tests never assert speed.
// jest-circus reads testTimeout from the global config only, so it is set here, once.
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }];

/** @type {import('jest').Config} */
module.exports = {
  testTimeout: 180_000,
  projects: [
    {
      displayName: 'unit',
      testEnvironment: 'node',
      testMatch: ['<rootDir>/test/shared/**/*.spec.ts', '<rootDir>/test/scripts/**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
    },
    {
      displayName: 'api',
      testEnvironment: 'node',
      testMatch: ['<rootDir>/test/server/**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
      globalSetup: '<rootDir>/test/support/api-global-setup.ts',
    },
    {
      displayName: 'client',
      preset: 'jest-preset-angular',
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      setupFilesAfterEnv: ['<rootDir>/test/support/client-setup.ts'],
      // Under jsdom, json-rules-engine's jsonpath-plus resolves to its ESM browser build, which jest cannot load.
      moduleNameMapper: { '^jsonpath-plus$': '<rootDir>/node_modules/jsonpath-plus/dist/index-browser-umd.cjs' },
      testMatch: ['<rootDir>/src/**/*.spec.ts'],
      transform: {
        '^.+\\.(ts|js|mjs|html|svg)$': ['jest-preset-angular', { tsconfig: '<rootDir>/tsconfig.spec.json', stringifyContentPathRegex: '\\.(html|svg)$' }],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$)'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      testMatch: ['<rootDir>/test/e2e/**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
      globalSetup: '<rootDir>/test/support/api-global-setup.ts',
    },
  ],
};
