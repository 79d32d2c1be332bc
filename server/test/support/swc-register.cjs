// Runs the server from its TypeScript source in a child process (the fault tests start and kill
// real server processes): compiles each .ts file on require with swc, decorators and their
// metadata included, as the jest transform does.
const { transformSync } = require('@swc/core');
const fs = require('node:fs');

require.extensions['.ts'] = function compile(module, filename) {
  const { code } = transformSync(fs.readFileSync(filename, 'utf8'), {
    filename,
    jsc: {
      parser: { syntax: 'typescript', decorators: true },
      transform: { legacyDecorator: true, decoratorMetadata: true },
      target: 'es2022',
    },
    module: { type: 'commonjs' },
    sourceMaps: 'inline',
  });
  module._compile(code, filename);
};
