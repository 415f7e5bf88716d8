// The client specs' transform for the ES-module bundles in node_modules (Angular, Material, CDK and the like):
// Angular's linker, then esbuild to CommonJS (DEVELOPERS.md, "Tests").
//
// Angular's packages ship partly compiled: each component, directive, pipe and injectable is a declaration
// (`ɵɵngDeclareComponent` …) that needs Angular's linker before it runs. The production build links them once;
// under jest, Angular's JIT compiler linked every declaration a spec touched at run time, again in every spec file
// (a fifth of the client project's CPU, in a profile). Here the linker (the Babel plugin the Angular CLI uses, in
// its JIT mode, as our own components are JIT-compiled in the specs) runs once per file in jest's transform, whose
// cache keeps the result. esbuild's step is the one jest-preset-angular takes for these files.
const { createHash } = require('node:crypto');
const babel = require('@babel/core');
const esbuild = require('esbuild');
const { createEs2015LinkerPlugin } = require('@angular/compiler-cli/linker/babel');
const { ConsoleLogger, LogLevel, NodeJSFileSystem } = require('@angular/compiler-cli');

const VERSIONS = ['@angular/compiler-cli', '@babel/core', 'esbuild']
  .map((name) => `${name}@${require(`${name}/package.json`).version}`)
  .join(' ');
let linker;

module.exports = {
  getCacheKey(source, filename) {
    return createHash('sha1').update(`${VERSIONS}\0${filename}\0`).update(source).digest('hex');
  },
  process(source, filename) {
    let code = source;
    if (source.includes('ɵɵngDeclare')) {
      linker ??= createEs2015LinkerPlugin({
        linkerJitMode: true,
        fileSystem: new NodeJSFileSystem(),
        logger: new ConsoleLogger(LogLevel.warn),
      });
      code = babel.transformSync(source, {
        filename,
        plugins: [linker],
        babelrc: false,
        configFile: false,
        compact: false,
        sourceMaps: false,
      }).code;
    }
    // As jest-preset-angular does for these bundles: CommonJS for jest's module registry, ES2016 syntax.
    const out = esbuild.transformSync(code, {
      loader: 'js',
      format: 'cjs',
      supported: { 'dynamic-import': false },
      target: 'es2016',
      sourcefile: filename,
    });
    return { code: out.code };
  },
};
