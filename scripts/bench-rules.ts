// Benchmark of checklist evaluation (wired into npm run bench). Prints figures; nothing here is a test.
// Typical calc: five segments, three features, fatigue, against KFD-ENG-014 v3.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { evaluateValidInput, validateCalcInput, type CalcInput } from '../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, validateRuleSet, type RuleSet } from '../shared/rules';
import { evaluateChecklist } from '../shared/rules/reference-checklist';

const ROOT = join(__dirname, '..');
const RUN_MS = 1500;
const REVISIONS = 10_000;

function load<T>(file: string, check: (v: unknown) => { ok: true; value: T } | { ok: false }): T {
  const v = check(JSON.parse(readFileSync(join(ROOT, file), 'utf8')));
  if (!v.ok) throw new Error(`${file} is invalid`);
  return v.value;
}

function report(name: string, count: number, ms: number): void {
  const perSecond = (count * 1000) / ms;
  console.log(
    `${name.padEnd(46)} ${Math.round(perSecond).toLocaleString('en-US').padStart(9)} /s  ${((1e3 * ms) / count).toFixed(1).padStart(8)} µs each`,
  );
}

async function rateAsync(name: string, fn: () => Promise<unknown>): Promise<void> {
  for (let i = 0; i < 300; i++) await fn();
  let count = 0;
  const start = performance.now();
  while (performance.now() - start < RUN_MS) {
    for (let i = 0; i < 20; i++) await fn();
    count += 20;
  }
  report(name, count, performance.now() - start);
}

function rateSync(name: string, fn: () => unknown): void {
  for (let i = 0; i < 3000; i++) fn();
  let count = 0;
  const start = performance.now();
  while (performance.now() - start < RUN_MS) {
    for (let i = 0; i < 200; i++) fn();
    count += 200;
  }
  report(name, count, performance.now() - start);
}

/** Re-evaluates REVISIONS slightly different revisions (engine + checklist) and returns the time in ms. */
async function impact(ruleSet: RuleSet, base: CalcInput, isSync: boolean): Promise<number> {
  const revisions = Array.from({ length: REVISIONS }, (_, k) => ({
    ...base,
    segments: base.segments.map((s) => ({ ...s, od: s.od * (1 + (k % 50) / 1000) })),
  }));
  const start = performance.now();
  let compliant = 0;
  for (const rev of revisions) {
    const input = applyRuleSetMethods(rev, ruleSet);
    const result = evaluateValidInput(input);
    const c = isSync ? evaluateChecklistSync(input, result, ruleSet) : await evaluateChecklist(input, result, ruleSet);
    if (c.verdict === 'compliant') compliant++;
  }
  const ms = performance.now() - start;
  console.log(
    `${REVISIONS.toLocaleString('en-US')} re-evaluations, ${isSync ? 'sync ' : 'async'} (engine + checklist): ${ms.toFixed(0).padStart(6)} ms  (${compliant} compliant)`,
  );
  return ms;
}

async function main(): Promise<void> {
  const ruleSet = load('rules/kfd-eng-014-v3.json', validateRuleSet);
  const raw = load('test/fixtures/calcs/five-segment-fatigue.json', validateCalcInput);
  const input = applyRuleSetMethods(raw, ruleSet);
  const result = evaluateValidInput(input);
  const rows = evaluateChecklistSync(input, result, ruleSet).rows.length;
  console.log(`Torquetrail rule-set benchmark · Node ${process.version} · one thread · ${RUN_MS} ms per figure`);
  console.log(
    `input: five-segment-fatigue.json (5 segments, 3 features, fatigue) against ${ruleSet.code} v${ruleSet.version}: ${ruleSet.clauses.length} clauses, ${rows} rows`,
  );
  await rateAsync('checklist, json-rules-engine (evaluateChecklist)', () => evaluateChecklist(input, result, ruleSet));
  rateSync('checklist, sync evaluator (evaluateChecklistSync)', () => evaluateChecklistSync(input, result, ruleSet));
  rateSync('engine + sync checklist (one keystroke)', () =>
    evaluateChecklistSync(input, evaluateValidInput(input), ruleSet),
  );
  await impact(ruleSet, raw, true);
  await impact(ruleSet, raw, false);
  console.log(
    'targets: a checklist under 5 ms (5,000 µs) in the browser; 10,000 re-evaluations in ≤ 2,000 ms on 2 cores',
  );
}

void main();
