/** Engine unit tests (src, *.spec.ts), compiled by SWC like the server's. */
/** @type {import('jest').Config} */
module.exports = {
  testEnvironment: 'node',
  // Property tests and exact-ML fits on 8,760 points take seconds on a busy machine.
  testTimeout: 60000,
  rootDir: __dirname,
  testMatch: ['<rootDir>/src/**/*.spec.ts'],
  // The command line imports the engine by package name; its tests run it on the source.
  moduleNameMapper: { '^@morrowline/engine$': '<rootDir>/src/index.ts' },
  transform: {
    '^.+\\.ts$': ['@swc/jest', { jsc: { parser: { syntax: 'typescript' }, target: 'es2022' }, module: { type: 'commonjs' } }],
  },
};
