/* global require, module */
/* eslint-disable @typescript-eslint/no-require-imports -- CommonJS on purpose: it runs before tsx */
// The worker thread's entry when the service runs from TypeScript source (tsx, jest): registers tsx's
// require hook in this thread, then loads the worker. The built service loads worker.js directly.
require('tsx/cjs/api').register();
module.exports = require('./worker.ts');
