import { evaluateValidInput, type CalcInput } from '../../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, type RuleSet } from '../../../shared/rules';
import { compareModels, describeDifference, verificationNeed } from '../../../shared/verification';
import { loadCalc, loadRuleSet } from '../rules/rules-helpers';

const LIFT2 = loadRuleSet('kfd-eng-021-v2.json');
const TOL = LIFT2.verification!.tolerances;

function modelOf(input: CalcInput, ruleSet: RuleSet = LIFT2) {
  const effective = applyRuleSetMethods(input, ruleSet);
  const result = evaluateValidInput(effective);
  return { input, result, checklist: evaluateChecklistSync(effective, result, ruleSet) };
}

// Conversion factors written out here (not taken from the engine), so the test is independent:
// 1 in = 25.4 mm, 1 ksi = 6.894757293168361 MPa, 1 lbf = 4.4482216152605 N, 1 hp = 0.7456998715822702 kW,
// 1 lb = 0.45359237 kg (exact or NIST SP 811, from memory).
const IN = 25.4;
const KSI = 6.894757293168361;
const LBF = 4.4482216152605;
const HP = 0.7456998715822702;
const LB = 0.45359237;

/** The countershaft fixture as a checker working in US customary units would enter it. */
function inUS(si: CalcInput): CalcInput {
  const len = (v: number) => v / IN;
  const m = si.material;
  return {
    ...si,
    units: 'US',
    material: {
      ...m,
      E: (m.E * 1000) / KSI / 1000,
      G: (m.G * 1000) / KSI / 1000,
      Sy: m.Sy / KSI,
      Su: m.Su / KSI,
      density: (m.density! * (IN / 1000) ** 3) / LB,
    },
    segments: si.segments.map((s) => ({ ...s, length: len(s.length), od: len(s.od), id: len(s.id) })),
    torques: si.torques.map((t) => ('power' in t ? { ...t, at: len(t.at), power: t.power / HP } : t)),
    supports: si.supports!.map((s) => ({ ...s, at: len(s.at), C: (s.C! * 1000) / LBF })),
    loads: si.loads!.map((l) => {
      const moved = { ...l, at: len(l.at) } as Record<string, unknown>;
      for (const k of ['pitchDiameter', 'diameter'])
        if (typeof moved[k] === 'number') moved[k] = len(moved[k] as number);
      return moved as typeof l;
    }),
    masses: si.masses!.map((x) => ({ ...x, at: len(x.at), mass: x.mass / LB })),
    features: si.features!.map((f) => {
      const moved = { ...f } as Record<string, unknown>;
      for (const k of ['at', 'width', 'height', 'length', 'r', 'depth'])
        if (typeof moved[k] === 'number') moved[k] = len(moved[k] as number);
      if (typeof moved.Sy === 'number') moved.Sy = (moved.Sy as number) / KSI;
      return moved as typeof f;
    }),
  };
}

const countershaft = () => loadCalc('two-bearing-gear-pulley.json');

describe('independent model comparison', () => {
  it('when both models are the same shaft, then every input and result agrees and nothing is a difference', () => {
    const c = compareModels(modelOf(countershaft()), modelOf(countershaft()), TOL);
    expect(c.agrees).toBe(true);
    expect(c.inputs.differences + c.results.differences).toBe(0);
    expect(c.rows.map((r) => r.key)).toEqual(
      expect.arrayContaining([
        'material.E',
        'segments[4].od',
        'torques[1].T',
        'features[2].depth',
        'supports[0].C',
        'loads[0].pitchDiameter',
        'masses[1].mass',
        'fatigue.reliability',
        'result.maxShear',
        'result.twistTotal',
        'result.minYieldSafety',
        'result.minFatigueSafety.soderberg',
        'result.supports[0].F',
        'result.criticalSpeed',
        'result.verdict',
      ]),
    );
    expect(c.rows.some((r) => r.group === 'clause')).toBe(true);
  });

  it('when the checker enters the same shaft in US customary units, then inputs are equal after conversion and results agree', () => {
    const c = compareModels(modelOf(countershaft()), modelOf(inUS(countershaft())), TOL);
    expect(c.rows.filter((r) => !r.agrees)).toEqual([]);
    const od = c.rows.find((r) => r.key === 'segments[1].od')!;
    expect(od.unit).toBe('mm');
    expect(od.checker).toBeCloseTo(45, 9);
    const C = c.rows.find((r) => r.key === 'supports[0].C')!;
    expect([C.unit, C.checker]).toEqual(['kN', expect.closeTo(25.5, 9)]);
  });

  it('when the checker reads a diameter 2 mm larger, then that input is a difference with both values and the relative gap', () => {
    const mine = countershaft();
    const theirs = countershaft();
    theirs.segments[1] = { ...theirs.segments[1], od: 47 };
    const c = compareModels(modelOf(mine), modelOf(theirs), TOL);
    const row = c.rows.find((r) => r.key === 'segments[1].od')!;
    expect(row).toEqual(
      expect.objectContaining({ section: 'input', group: 'segment', author: 45, checker: 47, agrees: false }),
    );
    expect(row.relative).toBeCloseTo(2 / 47, 12);
    expect(c.agrees).toBe(false);
    expect(describeDifference(row)).toBe(
      "Segment 2 outer diameter: author's model 45 mm, independent model 47 mm (differs by 4.26 %)",
    );
  });

  it("when a result differs by less than the standard's 2 %, then it agrees; more, and it is a difference", () => {
    const mine = countershaft();
    const near = countershaft();
    near.segments[4] = { ...near.segments[4], od: 35.02 }; // 0.06 %: an input difference, results within 2 %
    const c = compareModels(modelOf(mine), modelOf(near), { inputs: 0.001, results: 0.02 });
    expect(c.rows.find((r) => r.key === 'segments[4].od')!.agrees).toBe(true);
    expect(c.results.differences).toBe(0);
    const strict = compareModels(modelOf(mine), modelOf(near), { inputs: 0, results: 0 });
    expect(strict.rows.find((r) => r.key === 'segments[4].od')!.agrees).toBe(false);
    expect(strict.results.differences).toBeGreaterThan(0);
  });

  it('when the checker models one segment fewer, then the missing entry is one row, not one per field', () => {
    const theirs = countershaft();
    theirs.segments = theirs.segments.slice(0, 4);
    theirs.segments[3] = { ...theirs.segments[3], length: 220 };
    const c = compareModels(modelOf(countershaft()), modelOf(theirs), TOL);
    const rows = c.rows.filter((r) => r.key.startsWith('segments[4]'));
    expect(rows).toEqual([
      expect.objectContaining({ key: 'segments[4]', author: 'entered', checker: null, agrees: false }),
    ]);
  });

  it('when one model gives a torque as power and speed and the other as the same torque, then they agree', () => {
    const mine = countershaft();
    const theirs = countershaft();
    const T = (9549.296585513721 * 15) / 950;
    theirs.torques = [
      { at: 100, T },
      { at: 400, T: -T },
    ];
    const c = compareModels(modelOf(mine), modelOf(theirs), TOL);
    expect(c.rows.filter((r) => r.key.startsWith('torques')).every((r) => r.agrees)).toBe(true);
  });
});

describe('verification requirement', () => {
  const input = countershaft();
  it('when the standard asks for a model for every calc, then the calc needs one with the tolerances named', () => {
    const need = verificationNeed(LIFT2.verification, 'KFD-ENG-021', input);
    expect(need).toEqual({
      method: 'independent-model',
      tolerances: TOL,
      reason: expect.stringContaining('results within 2 %'),
    });
  });

  it("when the standard asks only above a duty level, then the author's largest torque decides, in N·m whatever the units", () => {
    const level = (value: number) => ({ ...LIFT2.verification!, scope: { kind: 'torque-at-least' as const, value } });
    // 15 kW at 950 rpm: 150.8 N·m.
    expect(verificationNeed(level(150), 'X', input).method).toBe('independent-model');
    expect(verificationNeed(level(151), 'X', input).method).toBe('review');
    expect(verificationNeed(level(150), 'X', inUS(input)).method).toBe('independent-model');
    expect(verificationNeed(level(151), 'X', inUS(input)).method).toBe('review');
    expect(verificationNeed(level(151), 'X', { units: 'SI' }).method).toBe('independent-model');
  });

  it('when the standard says nothing, then review by an independent checker applies', () => {
    expect(verificationNeed(undefined, 'KFD-ENG-014', input)).toEqual(
      expect.objectContaining({ method: 'review', tolerances: null }),
    );
  });
});
