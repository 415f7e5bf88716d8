// Measuring aid, off unless SPEC_CPU_LOG names a file (DEVELOPERS.md, "Tests"): each spec file appends one line
// "<worker pid> <start|end> <CPU ticks> <file>" when it starts and when its own afterAll hooks have run. The ticks
// (1/100 s) are the worker's user+system time plus that of its finished child processes (servers, Chromium, the
// calc command), read from /proc/self/stat. From one file's start to the next file's start in the same worker is
// that file's whole cost, its teardown included; `node scripts/cpu-log-report.cjs <file>` sums it up.
import { appendFileSync, readFileSync } from 'node:fs';

const out = process.env.SPEC_CPU_LOG;

function ticks(): number {
  const fields = readFileSync('/proc/self/stat', 'utf8').split(') ')[1].split(' ');
  // After "pid (comm) ": state is field 3, so utime, stime, cutime, cstime (fields 14–17) sit at 11–14.
  return fields.slice(11, 15).reduce((sum, n) => sum + Number(n), 0);
}

function note(event: string): void {
  if (out) appendFileSync(out, `${process.pid} ${event} ${ticks()} ${expect.getState().testPath}\n`);
}

note('start');
afterAll(() => note('end'));
