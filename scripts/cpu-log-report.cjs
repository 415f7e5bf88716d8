// Sums a SPEC_CPU_LOG file (test/support/cpu-log.ts) per spec file and per jest project folder, largest first.
// A file's cost runs from its start to the next start in the same worker; a worker's last file ends at its "end".
const fs = require('node:fs');
const path = require('node:path');

const rows = fs
  .readFileSync(process.argv[2], 'utf8')
  .trim()
  .split('\n')
  .map((line) => {
    const [pid, event, ticks, ...file] = line.split(' ');
    return { pid, event, ticks: Number(ticks), file: path.relative(process.cwd(), file.join(' ')) };
  });
const perFile = new Map();
for (const pid of new Set(rows.map((r) => r.pid))) {
  const list = rows.filter((r) => r.pid === pid);
  const starts = list.filter((r) => r.event === 'start');
  starts.forEach((start, i) => {
    const next = starts[i + 1] ?? list.filter((r) => r.event === 'end' && r.file === start.file).at(-1);
    if (next) perFile.set(start.file, (next.ticks - start.ticks) / 100);
  });
}
const perFolder = new Map();
for (const [file, s] of perFile) {
  const folder = file.startsWith('src/') ? 'src (client)' : file.split('/').slice(0, 2).join('/');
  perFolder.set(folder, (perFolder.get(folder) ?? 0) + s);
}
const show = (map, limit) =>
  [...map]
    .sort((a, b) => b[1] - a[1])
    .slice(0, limit)
    .forEach(([name, s]) => console.log(`${s.toFixed(1).padStart(8)}  ${name}`));
console.log('CPU-seconds per folder (workers and their finished child processes):');
show(perFolder, 20);
console.log(`\nCPU-seconds per file, largest ${process.argv[3] ?? 25}:`);
show(perFile, Number(process.argv[3] ?? 25));
