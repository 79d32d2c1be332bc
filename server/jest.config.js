/** Server tests: unit specs beside the code, integration tests in test/ against a real MariaDB. */
const swc = [
  '@swc/jest',
  {
    jsc: {
      parser: { syntax: 'typescript', decorators: true },
      transform: { legacyDecorator: true, decoratorMetadata: true },
      target: 'es2022',
    },
    module: { type: 'commonjs' },
  },
];

/** @type {import('jest').Config} */
module.exports = {
  // Read at the top level only; integration tests talk to a real database.
  testTimeout: 60000,
  projects: [
    {
      displayName: 'unit',
      testEnvironment: 'node',
      rootDir: __dirname,
      testMatch: ['<rootDir>/src/**/*.spec.ts'],
      transform: { '^.+\\.ts$': swc },
    },
    {
      displayName: 'integration',
      testEnvironment: 'node',
      rootDir: __dirname,
      testMatch: ['<rootDir>/test/**/*.e2e-spec.ts'],
      transform: { '^.+\\.ts$': swc },
    },
    {
      // Redis, two API nodes and two workers (scripts/test.sh cluster starts Redis and the database)
      displayName: 'cluster',
      testEnvironment: 'node',
      rootDir: __dirname,
      testMatch: ['<rootDir>/test/cluster/**/*.cluster-spec.ts'],
      transform: { '^.+\\.ts$': swc },
    },
  ],
};
