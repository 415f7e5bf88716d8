import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { bundleCommand } from './bundle';

const ROOT = join(__dirname, '..', '..');
let bundle: string | undefined;

/**
 * The calc command as a user runs it: a separate Node process in the repository root, reading `input` on standard
 * input when given, answering on stdout and stderr with an exit status. `tsx: true` runs scripts/calc.ts through
 * tsx's loader exactly as `npm run calc` (`tsx scripts/calc.ts`) does; by default the same sources run as one file
 * bundled by esbuild once per spec file (test/support/bundle.ts), at a sixth of the CPU time per run.
 */
export function runCalcCommand(args: string[], input?: string, options: { tsx?: boolean } = {}) {
  bundle ??= bundleCommand('scripts/calc.ts');
  const entry = options.tsx ? ['--import', 'tsx', 'scripts/calc.ts'] : [bundle];
  const r = spawnSync(process.execPath, [...entry, ...args], {
    cwd: ROOT,
    input,
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
