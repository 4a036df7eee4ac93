/**
 * The scaled set-up's own tests: real instances behind HAProxy on PostgreSQL and Redis. Run by
 * `npm run test:scaled` (scripts/with-engines.sh), which starts the engines; one file at a time, since
 * each starts several services.
 * @type {import('jest').Config}
 */
const base = require('../../jest.config.js');
module.exports = {
  ...base,
  rootDir: '../..',
  roots: ['<rootDir>/tests/scaled'],
  testPathIgnorePatterns: ['/node_modules/', '/dist/'],
  testTimeout: 120000,
};
