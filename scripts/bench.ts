// Benchmark of the calculation engine (npm run bench). Prints figures; nothing here is a test.
// Typical calc: the five-segment shaft with a keyseat, a fillet, a ring groove and fatigue.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { evaluateShaft, evaluateValidInput, validateCalcInput, type CalcInput } from '../shared/engine';

const FIXTURE = join(__dirname, '..', 'test', 'fixtures', 'calcs', 'five-segment-fatigue.json');
const RUN_MS = 1500;

function rate(name: string, fn: () => unknown): number {
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
  console.log(`${name.padEnd(44)} ${Math.round(perSecond).toLocaleString('en-US').padStart(10)} calcs/s  ${(1e6 / perSecond).toFixed(1).padStart(7)} µs/calc`);
  return perSecond;
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
  console.log(`single validate+evaluate latency: p50 ${at(0.5)}, p99 ${at(0.99)}, max ${at(1)} (${samples} samples)`);
}

const raw: unknown = JSON.parse(readFileSync(FIXTURE, 'utf8'));
const checked = validateCalcInput(raw);
if (!checked.ok) throw new Error('benchmark fixture is invalid');
const valid: CalcInput = checked.value;

console.log(`Torquetrail engine benchmark · Node ${process.version} · one thread · ${RUN_MS} ms per figure`);
console.log('input: test/fixtures/calcs/five-segment-fatigue.json (5 segments, 3 features, fatigue)');
rate('validate + evaluate (evaluateShaft)', () => evaluateShaft(raw));
rate('evaluate pre-validated (evaluateValidInput)', () => evaluateValidInput(valid));
rate('validate only (validateCalcInput)', () => validateCalcInput(raw));
rate('validate + evaluate + JSON.stringify', () => JSON.stringify(evaluateShaft(raw)));
latency(() => evaluateShaft(raw));
console.log('target: ≥ 50,000 calcs/s on one core; a browser recompute under 2 ms (2,000 µs)');
