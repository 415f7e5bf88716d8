// Benchmark of the calculation engine (npm run bench). Prints figures; nothing here is a test.
// Typical calc: the five-segment shaft with a keyseat, a fillet, a ring groove and fatigue.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import * as source from '../shared/engine';

type Engine = Pick<typeof source, 'evaluateShaft' | 'evaluateValidInput' | 'validateCalcInput'>;

const FIXTURES = join(__dirname, '..', 'test', 'fixtures', 'calcs');
const FIXTURE = join(FIXTURES, 'five-segment-fatigue.json');
const SHAFT_FIXTURE = join(FIXTURES, 'two-bearing-gear-pulley.json');
const RUN_MS = 1500;

function rate(name: string, fn: () => unknown): void {
  for (let i = 0; i < 5000; i++) fn(); // let the JIT settle before timing
  let count = 0;
  const start = performance.now();
  let now = start;
  while (now - start < RUN_MS) {
    for (let i = 0; i < 500; i++) fn();
    count += 500;
    now = performance.now();
  }
  const perSecond = (count * 1000) / (now - start);
  console.log(
    `  ${name.padEnd(44)} ${Math.round(perSecond).toLocaleString('en-US').padStart(10)} calcs/s  ${(1e6 / perSecond).toFixed(1).padStart(7)} µs/calc`,
  );
}

function latency(fn: () => unknown, samples = 20000): void {
  const times = new Float64Array(samples);
  for (let i = 0; i < samples; i++) {
    const t0 = performance.now();
    fn();
    times[i] = performance.now() - t0;
  }
  times.sort();
  const at = (p: number): string => `${(times[Math.min(samples - 1, Math.floor(p * samples))] * 1000).toFixed(1)} µs`;
  console.log(`  one validate+evaluate: p50 ${at(0.5)}, p99 ${at(1 - 1e-2)}, max ${at(1)} (${samples} samples)`);
}

function run(label: string, engine: Engine, raw: unknown): void {
  const checked = engine.validateCalcInput(raw);
  if (!checked.ok) throw new Error('benchmark fixture is invalid');
  console.log(label);
  rate('validate + evaluate (evaluateShaft)', () => engine.evaluateShaft(raw));
  rate('evaluate pre-validated (evaluateValidInput)', () => engine.evaluateValidInput(checked.value));
  rate('validate only (validateCalcInput)', () => engine.validateCalcInput(raw));
  rate('validate + evaluate + JSON.stringify', () => JSON.stringify(engine.evaluateShaft(raw)));
  latency(() => engine.evaluateShaft(raw));
}

// The browser runs the engine as one bundle; tsx compiles each file to its own module, which costs
// about half the speed here. esbuild comes with tsx; without it only the tsx figures are printed.
function bundled(): Engine | null {
  let esbuild: typeof import('esbuild');
  try {
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- optional, and loaded synchronously
    esbuild = require('esbuild');
  } catch {
    return null;
  }
  const out = esbuild.buildSync({
    entryPoints: [join(__dirname, '..', 'shared', 'engine', 'index.ts')],
    bundle: true,
    format: 'cjs',
    platform: 'neutral',
    mainFields: ['main', 'module'],
    write: false,
    logLevel: 'silent',
  });
  const dir = mkdtempSync(join(tmpdir(), 'torquetrail-bench-'));
  writeFileSync(join(dir, 'engine.js'), out.outputFiles[0].text);
  // eslint-disable-next-line @typescript-eslint/no-require-imports -- a bundle written at run time
  const engine: Engine = require(join(dir, 'engine.js'));
  rmSync(dir, { recursive: true, force: true });
  return engine;
}

const raw: unknown = JSON.parse(readFileSync(FIXTURE, 'utf8'));
const shaft: unknown = JSON.parse(readFileSync(SHAFT_FIXTURE, 'utf8'));
const engine = bundled();
console.log(`Torquetrail engine benchmark · Node ${process.version} · one thread · ${RUN_MS} ms per figure`);
console.log('input: test/fixtures/calcs/five-segment-fatigue.json (5 segments, 3 features, fatigue)');
run('engine as loaded by tsx (one module per file):', source, raw);
if (engine) run('engine as one esbuild bundle (as the browser loads it):', engine, raw);
console.log('target: ≥ 50,000 calcs/s on one core; a browser recompute under 2 ms (2,000 µs)');
console.log(
  '\ninput: test/fixtures/calcs/two-bearing-gear-pulley.json (whole shaft: 2 bearings, helical gear, pulley,',
);
console.log('       2 masses, 5 segments, 5 features, fatigue; reactions, deflection, bearing life, critical speed)');
run('engine as loaded by tsx (one module per file):', source, shaft);
if (engine) run('engine as one esbuild bundle (as the browser loads it):', engine, shaft);
console.log('target: ≥ 20,000 calcs/s on one core; a browser recompute under 2 ms (2,000 µs)');
