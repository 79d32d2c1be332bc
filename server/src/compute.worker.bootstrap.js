// Loads the TypeScript worker in a worker thread when the server runs from source (jest with
// its swc transform, or tsx): a worker thread gets no transform of its own, so tsx is
// registered here first. The compiled server loads dist/compute.worker.js directly.
require('tsx/cjs');
module.exports = require('./compute.worker.ts');
