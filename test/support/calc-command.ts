import { spawnSync } from 'node:child_process';
import { mkdirSync, renameSync } from 'node:fs';
import { join } from 'node:path';
import { buildSync } from 'esbuild';

const ROOT = join(__dirname, '..', '..');

// Inside node_modules so the bundle's own `require`s of packages (zod…) resolve as they do for scripts/calc.ts.
const BUNDLE = join(ROOT, 'node_modules', '.cache', 'torquetrail-calc', 'calc.cjs');
let built = false;

/**
 * scripts/calc.ts and what it imports, compiled by esbuild (what tsx compiles each file with) into one CommonJS
 * file, once per spec file. Running that costs about 0.2 CPU-seconds instead of 1.3 under tsx's loader, which
 * resolves and transpiles every module on each start (DEVELOPERS.md, "Tests"). Packages stay outside the bundle.
 */
function bundle(): string {
  if (!built) {
    mkdirSync(join(BUNDLE, '..'), { recursive: true });
    buildSync({
      entryPoints: [join(ROOT, 'scripts/calc.ts')],
      bundle: true,
      packages: 'external',
      platform: 'node',
      format: 'cjs',
      target: 'node20',
      outfile: `${BUNDLE}.${process.pid}`,
      logLevel: 'error',
    });
    // Spec files running side by side build the same file; each replaces it whole, never a half-written one.
    renameSync(`${BUNDLE}.${process.pid}`, BUNDLE);
    built = true;
  }
  return BUNDLE;
}

/**
 * The calc command as a user runs it: a separate Node process in the repository root, reading `input` on standard
 * input when given, answering on stdout and stderr with an exit status. `tsx: true` runs scripts/calc.ts through
 * tsx's loader exactly as `npm run calc` (`tsx scripts/calc.ts`) does; by default the same source runs as a bundle.
 */
export function runCalcCommand(args: string[], input?: string, options: { tsx?: boolean } = {}) {
  const entry = options.tsx ? ['--import', 'tsx', 'scripts/calc.ts'] : [bundle()];
  const r = spawnSync(process.execPath, [...entry, ...args], {
    cwd: ROOT,
    input,
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
