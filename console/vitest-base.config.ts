import { defineConfig } from 'vitest/config';

// Options the Angular unit-test builder (angular.json, target "test") does not set itself.
export default defineConfig({
  test: {
    // The property-based specs (fast-check against ajv, a real HTTP server for the snippets) take
    // seconds on a busy two-core machine; the same ceiling the root jest config uses.
    testTimeout: 30000,
    // Spec files share one module graph per worker (no isolation), so a global stubbed or a spy left
    // in one file would reach the next: both are undone after every test.
    unstubGlobals: true,
    restoreMocks: true,
    // jsdom lays nothing out, so the CDK finds no element focusable and warns for every dialog's
    // cdkFocusInitial; that says nothing about the console.
    // Nor does it draw: chart.js says it has no canvas context, and the chart specs check the
    // configuration it was given instead of pixels.
    onConsoleLog: (log) =>
      !['is not focusable', "can't acquire context", "HTMLCanvasElement's getContext()"].some((noise) =>
        log.includes(noise),
      ),
  },
});
