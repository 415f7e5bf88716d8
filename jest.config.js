// One runner for the whole repository (see DEVELOPERS.md): each project below is one layer.
// Time limits are hang detectors, never speed checks: the global one below covers unit and client specs;
// api and e2e run whole workflows and get a longer one from test/support/long-test-timeout.ts (jest-circus
// reads testTimeout from the global config only, so a per-project limit goes in a setup file).
// No spec sets its own limit.
// Node-side specs (unit, api, e2e) are transpiled by SWC (@swc/jest): tsc checks types once in the static checks,
// so the transform only strips them. With a cold cache, as in a fresh clone, ts-jest's TypeScript transpiler spent
// about 12 CPU-seconds on the server's files in each worker; SWC does it natively (DEVELOPERS.md, "Tests").
// Settings match tsconfig.json: ES2022 with define semantics for class fields, CommonJS as the server runs under tsx.
const swc = [
  '@swc/jest',
  {
    jsc: {
      parser: { syntax: 'typescript' },
      target: 'es2022',
      transform: { useDefineForClassFields: true },
    },
    module: { type: 'commonjs' },
    sourceMaps: 'inline',
  },
];

// shared/ holds no Angular code, so the client project strips its types with SWC too: the Angular transform below
// (TypeScript's own transpiler) took about 3.2 CPU-seconds for shared/'s files, SWC 0.1 (DEVELOPERS.md, "Tests").
const escaped = (text) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const sharedTs = `^${escaped(__dirname)}/shared/.+\\.ts$`;

// jest-preset-angular's settings, for our components and (after Angular's linker) the bundles in node_modules.
const ngTransform = { tsconfig: '<rootDir>/tsconfig.spec.json', stringifyContentPathRegex: '\\.(html|svg)$' };

// Every project runs on jest's runtime with V8's compiled code kept per worker between spec files (see the file).
const runtime = '<rootDir>/test/support/code-cache-runtime.cjs';

// SPEC_CPU_LOG=<file> logs each spec file's CPU time (test/support/cpu-log.ts), a measuring aid.
const cpuLog = process.env.SPEC_CPU_LOG ? ['<rootDir>/test/support/cpu-log.ts'] : [];

/** @type {import('jest').Config} */
module.exports = {
  testTimeout: 180_000,
  // After its last file a worker gets this long to exit before jest kills it and prints "A worker process has failed
  // to exit gracefully". jest's 500 ms default is too short on a loaded two-core machine: with nothing left open
  // (checked per file, DEVELOPERS.md "Tests") workers still missed it there. A real leak still shows, 10 s later.
  workerGracefulExitTimeout: 10_000,
  // The longest files start first, so no worker runs one alone at the end (see the file).
  testSequencer: '<rootDir>/test/support/test-sequencer.cjs',
  projects: [
    {
      displayName: 'unit',
      testEnvironment: 'node',
      runtime,
      testMatch: ['<rootDir>/test/shared/**/*.spec.ts', '<rootDir>/test/scripts/**/*.spec.ts'],
      transform: { '^.+\\.ts$': swc },
      setupFilesAfterEnv: cpuLog,
    },
    {
      displayName: 'api',
      testEnvironment: 'node',
      runtime,
      testMatch: ['<rootDir>/test/server/**/*.spec.ts'],
      transform: { '^.+\\.ts$': swc },
      globalSetup: '<rootDir>/test/support/api-global-setup.ts',
      setupFilesAfterEnv: ['<rootDir>/test/support/long-test-timeout.ts', ...cpuLog],
    },
    {
      displayName: 'client',
      preset: 'jest-preset-angular',
      runtime,
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      setupFilesAfterEnv: ['<rootDir>/test/support/client-setup.ts', ...cpuLog],
      testMatch: ['<rootDir>/src/**/*.spec.ts'],
      // The first pattern that matches a file picks its transform. jest-preset-angular compiles our components the way
      // Angular's JIT needs (templates inlined, signal inputs declared) and hands .mjs bundles to esbuild; the bundles
      // in node_modules (Angular, Material, CDK) go through Angular's linker first (see the file).
      transform: {
        [sharedTs]: swc,
        '/node_modules/.+\\.mjs$': ['<rootDir>/test/support/angular-link-transform.cjs', ngTransform],
        '^.+\\.(ts|js|mjs|html|svg)$': ['jest-preset-angular', ngTransform],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$)'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      runtime,
      testMatch: ['<rootDir>/test/e2e/**/*.spec.ts'],
      transform: { '^.+\\.ts$': swc },
      globalSetup: '<rootDir>/test/support/api-global-setup.ts',
      setupFilesAfterEnv: ['<rootDir>/test/support/long-test-timeout.ts', ...cpuLog],
    },
  ],
};
