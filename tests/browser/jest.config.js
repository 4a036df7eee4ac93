/** Browser tests: the built service in a child process, driven by Debian's Chromium through playwright-core. */
/** @type {import('jest').Config} */
module.exports = {
  rootDir: '../..',
  testEnvironment: 'node',
  roots: ['<rootDir>/tests/browser'],
  testMatch: ['**/*.test.ts'],
  transform: {
    '^.+\\.ts$': [
      '@swc/jest',
      { jsc: { target: 'es2022', parser: { syntax: 'typescript' } }, module: { type: 'commonjs' } },
    ],
  },
  moduleFileExtensions: ['ts', 'js', 'json'],
  globalSetup: '<rootDir>/tests/browser/support/global-setup.ts',
  maxWorkers: 1,
  testTimeout: 120000,
};
