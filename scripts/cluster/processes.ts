import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';

/**
 * Child processes of the cluster test. Every pid is also appended to a file the shell wrapper
 * reads on exit, so nothing outlives the run even when this process itself is killed.
 */
export class Processes {
  private readonly live = new Set<ChildProcess>();
  constructor(private readonly pidFile: string) {}

  start(name: string, command: string, args: string[], opts: { env?: NodeJS.ProcessEnv; log: string }): ChildProcess {
    const out = fs.openSync(opts.log, 'a');
    const child = spawn(command, args, { env: opts.env ?? process.env, stdio: ['ignore', out, out] });
    fs.closeSync(out);
    if (!child.pid) throw new Error(`${name} did not start`);
    fs.appendFileSync(this.pidFile, `${child.pid}\n`);
    this.live.add(child);
    child.on('exit', () => this.live.delete(child));
    return child;
  }

  /** SIGKILL, then wait until the kernel has reaped it (its ports and files are free). */
  async kill(child: ChildProcess): Promise<void> {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((resolve) => child.once('exit', resolve));
    child.kill('SIGKILL');
    await exited;
  }

  async stopAll(): Promise<void> {
    await Promise.all([...this.live].map((c) => this.kill(c)));
  }
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.on('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/**
 * Polls `check` until it returns true; never a fixed sleep standing in for a condition. `limitMs`
 * only turns a condition that never comes into a clear failure instead of a hung run.
 */
export async function waitFor(
  what: string,
  check: () => Promise<boolean>,
  limitMs = 180_000,
  everyMs = 250,
): Promise<void> {
  const end = Date.now() + limitMs;
  while (Date.now() < end) {
    if (await check().catch(() => false)) return;
    await new Promise((r) => setTimeout(r, everyMs));
  }
  throw new Error(`gave up waiting for ${what}`);
}
