import { defineConfig } from 'vitest/config';

// Options the Angular unit-test builder (angular.json, target "test") does not set itself.
export default defineConfig({
  test: {
    // The property-based specs (fast-check against ajv, a real HTTP server for the snippets) take
    // seconds on a busy two-core machine; the same ceiling the root jest config uses.
    testTimeout: 30000,
  },
});
