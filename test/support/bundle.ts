import { mkdirSync, readFileSync, renameSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { build, buildSync, stop, type BuildOptions, type Plugin } from 'esbuild';

/**
 * Our TypeScript behind a command or a server process, compiled by esbuild (what tsx compiles each file with) into one
 * CommonJS file that Node runs without a loader. Under tsx every start resolves and transpiles each module through
 * the loader's hooks: 1.3 CPU-seconds per calc command run instead of 0.2, 3.5–5 per server start instead of 1.4
 * (DEVELOPERS.md, "Tests"). Packages stay outside the bundle and load as they do under tsx.
 */
const ROOT = join(__dirname, '..', '..');
// Inside node_modules, so the bundle's `require`s of packages resolve as they do for the sources.
const OUT_DIR = join(ROOT, 'node_modules', '.cache', 'torquetrail-bundles');

// Each file keeps its own folder as __dirname (the server finds rules/, migrations/ and its worker file by it).
const ownDirname: Plugin = {
  name: 'own-dirname',
  setup(b) {
    b.onLoad({ filter: /\.ts$/ }, (file) => ({
      contents: readFileSync(file.path, 'utf8').replace(/\b__dirname\b/g, JSON.stringify(dirname(file.path))),
      loader: 'ts',
    }));
  },
};

function options(entry: string, outfile: string): BuildOptions {
  return {
    entryPoints: [join(ROOT, entry)],
    bundle: true,
    packages: 'external',
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    // Names clash across files in one bundle and esbuild renames them; Sequelize names each model by its class name.
    keepNames: true,
    outfile,
    logLevel: 'error',
  };
}

// Spec files running side by side build the same bundle; each replaces it whole, never leaving a half-written one.
function outputs(entry: string) {
  mkdirSync(OUT_DIR, { recursive: true });
  const file = join(OUT_DIR, `${entry.replace(/[/.]/g, '-')}.cjs`);
  return { file, partial: `${file}.${process.pid}` };
}

/** Bundles `entry` (from the repository root) for a command; its sources must not use __dirname. */
export function bundleCommand(entry: string): string {
  const { file, partial } = outputs(entry);
  buildSync(options(entry, partial));
  renameSync(partial, file);
  return file;
}

/** Bundles `entry` (from the repository root) for a server process, each source keeping its own __dirname. */
export async function bundleServer(entry: string): Promise<string> {
  const { file, partial } = outputs(entry);
  try {
    await build({ ...options(entry, partial), plugins: [ownDirname] });
  } finally {
    await stop(); // plugins need esbuild's service process; end it so nothing is left running after the spec file
  }
  renameSync(partial, file);
  return file;
}

let serverMain: Promise<string> | undefined;

/**
 * How a spec forks a real server process: server/main.ts bundled once per spec file, or, with `tsx: true`, the sources
 * under tsx's loader exactly as `npm start` runs them. Either way the process reports `{ ready, port }` when listening.
 */
export async function serverProcessArgs(options: { tsx?: boolean } = {}) {
  if (options.tsx) return { modulePath: join(ROOT, 'server/main.ts'), execArgv: ['--import', 'tsx'] };
  serverMain ??= bundleServer('server/main.ts');
  return { modulePath: await serverMain, execArgv: [] };
}
