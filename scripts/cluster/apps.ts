import fs from 'node:fs';
import path from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { waitFor, type Processes } from './processes';

/** The app instances behind HAProxy: the same server `npm start` runs, each on its own port. */
export class AppInstances {
  private readonly children: (ChildProcess | undefined)[] = [];
  constructor(
    private readonly procs: Processes,
    private readonly env: NodeJS.ProcessEnv,
    readonly ports: number[],
    private readonly dir: string,
  ) {}

  private log(i: number): string {
    return path.join(this.dir, `app${i + 1}.log`);
  }

  async start(i: number): Promise<void> {
    const child = this.procs.start(`app${i + 1}`, process.execPath, ['--import', 'tsx', 'server/main.ts'], {
      env: { ...this.env, PORT: String(this.ports[i]), LOG_LEVEL: 'info' },
      log: this.log(i),
    });
    this.children[i] = child;
    await waitFor(`app instance ${i + 1} to be healthy`, async () => {
      if (child.exitCode !== null) throw new Error(`app instance ${i + 1} exited; see ${this.log(i)}`);
      return (await fetch(`http://127.0.0.1:${this.ports[i]}/api/health`)).ok;
    });
  }

  async kill(i: number): Promise<void> {
    const child = this.children[i];
    if (child) await this.procs.kill(child);
  }

  /** Transaction retries and abandoned transactions, by cause, from the instances' JSON logs. */
  retryCounts(): Record<string, number> {
    const counts: Record<string, number> = {};
    this.ports.forEach((_p, i) => {
      for (const line of fs.readFileSync(this.log(i), 'utf8').split('\n')) {
        if (!line.includes('"msg":"transaction')) continue;
        const entry = JSON.parse(line) as { msg: string; cause: string };
        const key = `${entry.msg === 'transaction retried' ? 'retried' : 'abandoned'} (${entry.cause})`;
        counts[key] = (counts[key] ?? 0) + 1;
      }
    });
    return counts;
  }
}
