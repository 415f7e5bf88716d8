import { spawnSync } from 'node:child_process';
import { join } from 'node:path';

const ROOT = join(__dirname, '..', '..');

/**
 * The calc command as a user runs it (`npm run calc` is `tsx scripts/calc.ts`): a separate Node process with tsx's
 * loader, in the repository root, reading `input` on standard input when given. It starts node with the loader
 * directly instead of through `npx tsx`, which spends about 1.5 s of CPU per run resolving the package first.
 */
export function runCalcCommand(args: string[], input?: string) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/calc.ts', ...args], {
    cwd: ROOT,
    input,
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
