/** @type {import('jest').Config} */
module.exports = {
  testEnvironment: 'node',
  // The console's specs run in Angular's unit-test builder (vitest + jsdom): `npm run test:console`.
  roots: ['<rootDir>/shared', '<rootDir>/api', '<rootDir>/tests'],
  testMatch: ['**/*.spec.ts', '**/*.test.ts'],
  testPathIgnorePatterns: ['/node_modules/', '/dist/', '<rootDir>/tests/browser/', '<rootDir>/tests/scaled/'],
  transform: {
    '^.+\\.ts$': [
      '@swc/jest',
      { jsc: { target: 'es2022', parser: { syntax: 'typescript' } }, module: { type: 'commonjs' } },
    ],
  },
  moduleFileExtensions: ['ts', 'js', 'json'],
  testTimeout: 30000,
};
