// `npm run bench` part: comparing the author's model with the checker's independent model (issue 15).
import { performance } from 'node:perf_hooks';
import { evaluateValidInput, validateCalcInput, type CalcInput } from '../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, validateRuleSet } from '../shared/rules';
import { compareModels } from '../shared/verification';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** An invented 20-segment shaft: stepped seats with fillets, two bearings, a gear, a pulley, masses and fatigue. */
function twentySegments(bump = 0): CalcInput {
  const segments = Array.from({ length: 20 }, (_, i) => ({
    length: 40 + (i % 3) * 5,
    od: 50 + (i % 2) * 6 + (i === 7 ? bump : 0),
    id: 0,
  }));
  const stations = segments.reduce<number[]>((at, s) => [...at, at[at.length - 1] + s.length], [0]);
  const v = validateCalcInput({
    units: 'SI',
    material: { name: 'AISI 1045 CD', kind: 'steel', E: 207, G: 79.3, nu: 0.292, Sy: 530, Su: 630 },
    segments,
    torques: [
      { at: 100, power: 15, speed: 950 },
      { at: 700, power: -15, speed: 950 },
    ],
    features: stations.slice(1, -1).map((at) => ({ type: 'shoulder-fillet', at, r: 1.5 })),
    supports: [
      { at: 30, kind: 'deep-groove-ball', C: 30, locating: true },
      { at: 820, kind: 'cylindrical-roller', C: 50 },
    ],
    loads: [
      { at: 100, kind: 'gear', pitchDiameter: 180 },
      { at: 700, kind: 'pulley', diameter: 200, direction: 90 },
    ],
    masses: [
      { at: 100, mass: 7.5 },
      { at: 700, mass: 4.2 },
    ],
    fatigue: { surface: 'machined', reliability: 99 },
  });
  if (!v.ok) throw new Error(JSON.stringify(v.issues));
  return v.value;
}

const raw = JSON.parse(readFileSync(join(__dirname, '..', 'rules', 'kfd-eng-021-v2.json'), 'utf8'));
delete raw.$schema;
const checked = validateRuleSet(raw);
if (!checked.ok) throw new Error('rules/kfd-eng-021-v2.json is not valid');
const ruleSet = checked.value;

// Stored as the server stores them (JSON text), parsed again on every comparison as the lock step does.
function stored(input: CalcInput) {
  const effective = applyRuleSetMethods(input, ruleSet);
  const result = evaluateValidInput(effective);
  return {
    input: JSON.stringify(input),
    result: JSON.stringify(result),
    checklist: JSON.stringify(evaluateChecklistSync(effective, result, ruleSet)),
  };
}
const author = stored(twentySegments());
const checker = stored(twentySegments(2));
const parse = (s: typeof author) => ({
  input: JSON.parse(s.input),
  result: JSON.parse(s.result),
  checklist: JSON.parse(s.checklist),
});

const a = parse(author);
const b = parse(checker);
function measure(label: string, fn: () => { rows: { agrees: boolean }[] }): void {
  const times: number[] = [];
  let rows = 0;
  let differences = 0;
  for (let i = 0; i < 300; i++) {
    const t0 = performance.now();
    const c = fn();
    times.push(performance.now() - t0);
    rows = c.rows.length;
    differences = c.rows.filter((r) => !r.agrees).length;
  }
  times.sort((x, y) => x - y);
  const at = (q: number) => `${times[Math.min(times.length - 1, Math.floor(q * times.length))].toFixed(2)} ms`;
  console.log(
    `  ${label} (${rows} rows, ${differences} differences): p50 ${at(0.5)}, p99 ${at(0.99)}, max ${at(1)} (${times.length} runs)`,
  );
}
console.log(
  'Independent model comparison · 20-segment shaft (19 fillets, 2 bearings, gear, pulley, masses, fatigue) under KFD-ENG-021 v2',
);
measure('compare two models and their results', () => compareModels(a, b, ruleSet.verification!.tolerances));
measure('the same, parsing both stored models first', () =>
  compareModels(parse(author), parse(checker), ruleSet.verification!.tolerances),
);
console.log('  target: < 50 ms on the server');
