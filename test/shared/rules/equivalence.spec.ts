import fc from 'fast-check';
import { Engine } from 'json-rules-engine';
import { validateCalcInput, type CalcInput } from '../../../shared/engine';
import { compileCondition, OPERATORS, type Condition, type TopCondition } from '../../../shared/rules';
import { useLimitOperators } from '../../../shared/rules/reference-checklist';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { conveyorHeadShaft, hoistDrumShaft } from '../../../server/db/demo/demo-handling-shafts';
import { mixerShaft, slurryPumpShaft } from '../../../server/db/demo/demo-process-shafts';
import { checklistAsync, checklistSync, LIFT, loadCalc, loadRuleSet, V2, V3 } from './rules-helpers';

/*
 * The synchronous evaluator must give json-rules-engine 7.3.1's answers: the same checklist for every
 * shipped clause, and the same true / false / throws for generated conditions and facts.
 */
const RULE_SETS = [V3, V2, LIFT];
const FIXTURES = ['five-segment-fatigue.json', 'hollow-si.json', 'solid-si.json', 'stepped-us.json'];

describe('sync evaluator ≡ json-rules-engine on the shipped standards', () => {
  it.each(RULE_SETS.flatMap((rs) => FIXTURES.map((f) => [`${rs.code} v${rs.version}`, f, rs] as const)))(
    'when %s is evaluated on %s, then both paths give the same checklist',
    async (_name, fixture, rs) => {
      const input = loadCalc(fixture);
      expect(checklistSync(input, rs)).toEqual(await checklistAsync(input, rs));
    },
  );

  // The server stores the compiled evaluator's checklist on every save: every standard in rules/ on every whole
  // shaft the product ships (bearings, gears, pulleys, masses: the support and load clauses) and every fixture.
  const ALL_RULE_SETS = readdirSync(join(__dirname, '../../../rules'))
    .filter((f) => f.endsWith('.json'))
    .map((f) => [f, loadRuleSet(f)] as const);
  const SHAFTS: [string, unknown][] = [
    ['the demo conveyor head shaft', conveyorHeadShaft()],
    ['the demo conveyor head shaft, short hub seat', conveyorHeadShaft(40)],
    ['the demo hoist drum shaft', hoistDrumShaft()],
    ['the demo hoist drum shaft, far bearing moved', hoistDrumShaft(900)],
    ['the demo slurry pump shaft', slurryPumpShaft()],
    ['the demo mixer shaft', mixerShaft()],
    ['the demo mixer shaft, thin wall', mixerShaft(90, 114.3, 110)],
    ...['two-bearing-gear-pulley.json', ...FIXTURES].map((f): [string, unknown] => [f, loadCalc(f)]),
  ];
  it.each(ALL_RULE_SETS.flatMap(([file, rs]) => SHAFTS.map(([name, raw]) => [file, name, rs, raw] as const)))(
    'when %s is evaluated on %s, then both paths give the same checklist',
    async (_file, _name, rs, raw) => {
      const v = validateCalcInput(raw);
      if (!v.ok) throw new Error(JSON.stringify(v.issues));
      expect(checklistSync(v.value, rs)).toEqual(await checklistAsync(v.value, rs));
    },
  );

  it('when many checklists run at once on one cached engine, then each equals its synchronous twin', async () => {
    // json-rules-engine keeps one run status per Engine; overlapping runs must not skip rules.
    const inputs = FIXTURES.flatMap((f) => [loadCalc(f), loadCalc(f)]);
    const all = await Promise.all(inputs.map((input) => checklistAsync(input, V3)));
    all.forEach((c, i) => expect(c).toEqual(checklistSync(inputs[i], V3)));
  });

  const calcArb = fc.record({
    od: fc.double({ min: 15, max: 120, noNaN: true }),
    ratio: fc.constantFrom(0, 0.3, 0.6),
    T: fc.double({ min: 1, max: 4000, noNaN: true }),
    kind: fc.constantFrom('steel', 'aluminium'),
    Ma: fc.double({ min: 0, max: 2000, noNaN: true }).map((m) => (m < 1e-3 ? 0 : m)),
    hasFatigue: fc.boolean(),
    keyKt: fc.option(fc.double({ min: 1, max: 4, noNaN: true })),
    form: fc.constantFrom('end-mill', 'sled-runner'),
    key: fc.boolean(),
  });

  it('when calcs are generated, then both paths give the same checklist for every standard', async () => {
    let valid = 0;
    await fc.assert(
      fc.asyncProperty(calcArb, async (g) => {
        const keyseat = {
          type: 'keyseat',
          form: g.form,
          at: 300,
          ...(g.keyKt === null ? {} : { Kt: g.keyKt, source: 'generated' }),
          ...(g.form === 'sled-runner' ? { Kts: 2, source: 'generated' } : {}),
          ...(g.key ? { width: g.od / 4, height: g.od / 6, length: g.od, Sy: 390 } : {}),
        };
        const raw = {
          units: 'SI',
          material: { kind: g.kind, E: 207, G: 79.3, Sy: 530, Su: 630 },
          segments: [
            { length: 300, od: g.od * 1.2, id: g.od * 1.2 * g.ratio },
            { length: 500, od: g.od, id: g.od * g.ratio },
          ],
          torques: [
            { at: 100, T: g.T, Ta: g.T / 5 },
            { at: 700, T: -g.T, Ta: -g.T / 5 },
          ],
          features: [{ type: 'shoulder-fillet', at: 300, r: g.od * 0.05 }, keyseat],
          bending: [
            { at: 0, Ma: 0 },
            { at: 400, Ma: g.Ma },
            { at: 800, Ma: 0 },
          ],
          ...(g.hasFatigue ? { fatigue: { surface: 'machined' } } : {}),
        };
        const v = validateCalcInput(raw);
        if (!v.ok) throw new Error(JSON.stringify(v.issues));
        valid++;
        for (const rs of RULE_SETS)
          expect(checklistSync(v.value as CalcInput, rs)).toEqual(await checklistAsync(v.value as CalcInput, rs));
      }),
      { numRuns: 40, seed: 20251201 },
    );
    expect(valid).toBeGreaterThanOrEqual(40);
  });
});

const NAMES = ['n', 'm', 'z', 'b', 's', 'obj', 'arr', 'nul', 'param:p', 'param:q', 'missing'];
const scalar = fc.oneof(
  fc.double({ min: -5, max: 5, noNaN: true }),
  fc.integer({ min: -3, max: 3 }),
  fc.boolean(),
  fc.constant(null),
  fc.constantFrom('steel', 'keyseat', '3', '12abc', ''),
);
const value = fc.oneof(
  scalar,
  fc.array(scalar, { maxLength: 3 }),
  fc.record(
    {
      fact: fc.constantFrom(...NAMES),
      path: fc.option(fc.constantFrom('$.goodman', '$.gerber', '$.length', '$.nope'), { nil: undefined }),
    },
    { requiredKeys: ['fact'] },
  ),
);
const leaf = fc.record(
  {
    fact: fc.constantFrom(...NAMES),
    operator: fc.constantFrom(...OPERATORS, ...OPERATORS, 'bogus'),
    value,
    path: fc.option(fc.constantFrom('$.goodman', '$.gerber', '$.length', '$.nope'), { nil: undefined }),
  },
  { requiredKeys: ['fact', 'operator', 'value'] },
);
const { top } = fc.letrec<{ cond: Condition; top: TopCondition }>((tie) => ({
  cond: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    leaf as fc.Arbitrary<Condition>,
    tie('top') as fc.Arbitrary<Condition>,
  ),
  top: fc.oneof(
    fc.record({ all: fc.array(tie('cond'), { maxLength: 3 }) }),
    fc.record({ any: fc.array(tie('cond'), { maxLength: 3 }) }),
    fc.record({ not: tie('cond') }),
  ) as fc.Arbitrary<TopCondition>,
}));
const factsArb = fc.record({
  n: scalar,
  m: fc.double({ min: -5, max: 5, noNaN: true }),
  z: fc.constant(0),
  b: fc.boolean(),
  s: fc.constantFrom('steel', 'aluminium', '2'),
  obj: fc.option(fc.record({ goodman: fc.option(fc.double({ min: 0, max: 4, noNaN: true })), gerber: scalar })),
  arr: fc.array(scalar, { maxLength: 3 }),
  nul: fc.constant(null),
});
const PARAMS = { 'param:p': 2, 'param:q': 'steel' };

async function viaEngine(conditions: TopCondition, facts: Record<string, unknown>): Promise<string> {
  const engine = useLimitOperators(
    new Engine([{ name: 'r', conditions: JSON.parse(JSON.stringify(conditions)), event: { type: 'x' } }], {
      allowUndefinedFacts: false,
    }),
  );
  for (const [k, v] of Object.entries(PARAMS)) engine.addFact(k, v);
  try {
    const r = await engine.run(facts);
    return r.results.length ? 'true' : r.failureResults.length ? 'false' : 'no result';
  } catch {
    return 'throws';
  }
}

function viaSync(conditions: TopCondition, facts: Record<string, unknown>): string {
  try {
    return String(compileCondition(conditions)(facts, PARAMS));
  } catch {
    return 'throws';
  }
}

describe('sync evaluator ≡ json-rules-engine on generated conditions', () => {
  it('when conditions and facts are generated (operators, paths, fact references, nulls, lists, unknown names), then the outcomes agree', async () => {
    const seen: Record<string, number> = {};
    await fc.assert(
      fc.asyncProperty(top, factsArb, async (c, facts) => {
        const outcome = await viaEngine(c, facts);
        expect(viaSync(c, facts)).toBe(outcome);
        seen[outcome] = (seen[outcome] ?? 0) + 1;
      }),
      { numRuns: 1500, seed: 4242 },
    );
    // The generator must exercise every outcome, or the comparison proves little.
    for (const outcome of ['true', 'false', 'throws']) expect(seen[outcome]).toBeGreaterThan(100);
  });

  it('when a list condition is empty, then both treat it as json-rules-engine does (all [] and any [] are true)', async () => {
    for (const c of [{ all: [] }, { any: [] }, { not: { all: [] } }] as TopCondition[])
      expect(viaSync(c, {})).toBe(await viaEngine(c, {}));
    expect(viaSync({ any: [] }, {})).toBe('true');
  });
});
