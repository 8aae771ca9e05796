// Runs the API's TypeScript sources in a plain child process (the fault tests kill it with
// SIGKILL, which jest's own workers cannot take): each .ts file is transpiled on load with the
// compiler options the API builds with, and @shuntwise/contracts resolves to its sources, as in jest.
const Module = require('node:module');
const { readFileSync } = require('node:fs');
const { join } = require('node:path');
const ts = require('typescript');

const contracts = join(__dirname, '..', '..', '..', 'contracts', 'src', 'index.ts');
const compilerOptions = {
  module: ts.ModuleKind.CommonJS,
  target: ts.ScriptTarget.ES2023,
  experimentalDecorators: true,
  emitDecoratorMetadata: true,
  useDefineForClassFields: false,
  esModuleInterop: true,
  sourceMap: false,
  inlineSourceMap: true,
};

const resolve = Module._resolveFilename;
Module._resolveFilename = function (request, ...rest) {
  return resolve.call(this, request === '@shuntwise/contracts' ? contracts : request, ...rest);
};

require.extensions['.ts'] = (module, filename) => {
  const { outputText } = ts.transpileModule(readFileSync(filename, 'utf8'), { compilerOptions, fileName: filename });
  module._compile(outputText, filename);
};
