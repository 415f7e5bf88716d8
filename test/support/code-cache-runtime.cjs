// jest's module runtime (jest-runtime), unchanged except that each worker keeps V8's compiled code of every module
// it has run, for the next spec file (DEVELOPERS.md, "Tests").
//
// jest gives every spec file a fresh module registry, so each file compiles Sequelize, Express, Angular and our own
// code again from source: that was 8 % of the API specs' CPU (V8's compile, in a profile of the whole project).
// V8 can take a module's compiled code from a cache instead (its "code cache", Node's vm `cachedData`). The cache is
// made from the first file's script after it has run, so it holds the functions that were actually called, not
// only the top level. jest-runtime calls `vm.compileFunction` through the module object at each call, so
// replacing it here, in the worker, before jest-runtime compiles anything, is enough; other callers (no parsing
// context, or their own cache options) go straight to Node's. The function is built the same way: the module's
// code as a function body of jest's parameters, compiled in the spec file's context, line numbers unchanged.
// Measured on this 2-core machine: API specs 211 → 192 CPU-seconds, client specs 92 → 86.
const vm = require('node:vm');

const compileFunction = vm.compileFunction;
/** @type {Map<string, { code: string; params: string; script: vm.Script; data?: Buffer }>} */
const compiled = new Map();

vm.compileFunction = function compileWithCodeCache(code, params, options) {
  const filename = options?.filename;
  if (!filename || !options.parsingContext || options.cachedData || options.produceCachedData)
    return compileFunction.call(this, code, params, options);
  const parameters = params.join(', ');
  const known = compiled.get(filename);
  // The same file can be transformed differently by two projects; the cache is only for the very same code.
  const reusable = known && known.code === code && known.params === parameters;
  if (reusable) known.data ??= known.script.createCachedData();
  const script = new vm.Script(`(function (${parameters}) {\n${code}\n})`, {
    filename,
    lineOffset: -1, // the module's first line stays line 1 in stack traces and source maps
    cachedData: reusable ? known.data : undefined,
    importModuleDynamically: options.importModuleDynamically,
  });
  if (!reusable || script.cachedDataRejected) compiled.set(filename, { code, params: parameters, script });
  return script.runInContext(options.parsingContext);
};

module.exports = require('jest-runtime');
