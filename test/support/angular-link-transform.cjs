// The client specs' transform for the ES-module bundles in node_modules (Angular, Material, CDK and the like):
// Angular's linker, then jest-preset-angular's own transform of such bundles (DEVELOPERS.md, "Tests").
//
// Angular's packages ship partly compiled: each component, directive, pipe and injectable is a declaration
// (`ɵɵngDeclareComponent` …) that needs Angular's linker before it runs. The production build links them once;
// under jest, Angular's JIT compiler linked every declaration a spec touched at run time, again in every spec file
// (a fifth of the client project's CPU, in a profile). Here the linker (the Babel plugin the Angular CLI uses, in
// its JIT mode, as our own components are JIT-compiled in the specs) runs once per file in jest's transform, whose
// cache keeps the result. The linked code then goes to jest-preset-angular (esbuild to CommonJS), as before.
const { createHash } = require('node:crypto');
const babel = require('@babel/core');
const { default: ngPreset } = require('jest-preset-angular');
const { createEs2015LinkerPlugin } = require('@angular/compiler-cli/linker/babel');
const { ConsoleLogger, LogLevel, NodeJSFileSystem } = require('@angular/compiler-cli');

const VERSIONS = ['@angular/compiler-cli', '@babel/core']
  .map((name) => `${name}@${require(`${name}/package.json`).version}`)
  .join(' ');
let linker;

function link(source, filename) {
  if (!source.includes('ɵɵngDeclare')) return source;
  linker ??= createEs2015LinkerPlugin({
    linkerJitMode: true,
    fileSystem: new NodeJSFileSystem(),
    logger: new ConsoleLogger(LogLevel.warn),
  });
  return babel.transformSync(source, {
    filename,
    plugins: [linker],
    babelrc: false,
    configFile: false,
    compact: false,
    sourceMaps: false,
  }).code;
}

/** `config` is jest-preset-angular's own (jest.config.js passes the client project's). */
module.exports = {
  createTransformer(config) {
    const ng = ngPreset.createTransformer(config);
    return {
      getCacheKey: (source, filename, options) =>
        createHash('sha1')
          .update(`${VERSIONS}\0`)
          .update(ng.getCacheKey(source, filename, options))
          .digest('hex'),
      process: (source, filename, options) => ng.process(link(source, filename), filename, options),
    };
  },
};
