import { evaluateValidInput, validateCalcInput, type CalcInput } from '../../../shared/engine';
import { evaluateChecklistSync, validateRuleSet } from '../../../shared/rules';
import { evaluateChecklist } from '../../../shared/rules/reference-checklist';
import { conveyorHeadShaft } from '../../../server/db/demo/demo-handling-shafts';
import { mixerShaft, slurryPumpShaft } from '../../../server/db/demo/demo-process-shafts';
import { checklistSync, loadCalc, loadRuleSet, only, V3 } from './rules-helpers';

// KFD-ENG-014 v4: the clauses on bearings, gears and the critical speed, on the fixtures and demo shafts.
const V4 = loadRuleSet('kfd-eng-014-v4.json');
const valid = (raw: unknown): CalcInput => {
  const v = validateCalcInput(raw);
  if (!v.ok) throw new Error(JSON.stringify(v.issues));
  return v.value;
};

describe('KFD-ENG-014 v4 beam clauses', () => {
  it('when the two-bearing fixture is checked, then each bearing and the gear get a row with its limit', () => {
    const c = checklistSync(loadCalc('two-bearing-gear-pulley.json'), V4);
    expect(c.rows.filter((r) => r.status === 'error')).toEqual([]);
    const slope = c.rows.filter((r) => r.clauseId === '9.1');
    expect(slope.map((r) => [r.location.label, r.limit])).toEqual([
      ['bearing 1 "left bearing" (deep-groove-ball) at 20 mm', 0.001],
      ['bearing 2 "right bearing" (cylindrical-roller) at 350 mm', 0.0008],
    ]);
    expect(slope.every((r) => r.status === 'pass' && r.unit === 'rad')).toBe(true);
    const gear = c.rows.filter((r) => r.clauseId === '9.2' && r.status !== 'not-applicable');
    expect(gear).toHaveLength(1);
    expect(gear[0]).toMatchObject({ status: 'pass', unit: 'mm', limit: 0.127 });
    expect(c.rows.filter((r) => r.clauseId === '9.4').map((r) => r.unit)).toEqual(['h', 'h']);
    expect(c.rows.find((r) => r.clauseId === '9.5')).toMatchObject({ status: 'pass', limit: 2 });
  });

  it('when the critical speed is below twice the operating speed, then 9.5 fails naming both', () => {
    const input = valid({
      ...loadCalc('two-bearing-gear-pulley.json'),
      speed: 20000,
      torques: [
        { at: 100, T: 150 },
        { at: 400, T: -150 },
      ],
    });
    const row = checklistSync(input, only(V4, ['9.5'])).rows[0];
    expect(row.status).toBe('fail');
    expect(row.message).toMatch(/ratio of first critical speed to operating speed 1\.\d+ is below the minimum of 2/);
  });

  it('when no operating speed is known, then 9.5 fails as not available instead of passing', () => {
    const input = valid({
      ...loadCalc('two-bearing-gear-pulley.json'),
      torques: [
        { at: 100, T: 150 },
        { at: 400, T: -150 },
      ],
    });
    const row = checklistSync(input, only(V4, ['9.5'])).rows[0];
    expect(row).toMatchObject({ status: 'fail', actual: null });
  });

  it('when a US calc is checked, then the gear deflection row is shown in inches against 0.005 in', () => {
    const si = loadCalc('two-bearing-gear-pulley.json');
    const us = valid({
      ...si,
      units: 'US',
      material: { ...si.material, E: 30, G: 11.5, Sy: 77, Su: 91, density: 0.283 },
      segments: si.segments.map((s) => ({ ...s, length: s.length / 25.4, od: s.od / 25.4 })),
      torques: [
        { at: 100 / 25.4, T: 1000 },
        { at: 400 / 25.4, T: -1000 },
      ],
      supports: si.supports!.map((s) => ({ ...s, at: s.at / 25.4, C: (s.C ?? 1) * 224.8 })),
      loads: si.loads!.map((l) => ({
        ...l,
        at: l.at / 25.4,
        ...('pitchDiameter' in l ? { pitchDiameter: l.pitchDiameter / 25.4 } : {}),
        ...('diameter' in l ? { diameter: l.diameter / 25.4 } : {}),
      })),
      masses: [],
      features: [],
      fatigue: undefined,
    });
    const row = checklistSync(us, only(V4, ['9.2'])).rows[0];
    expect(row.unit).toBe('in');
    expect(row.limit).toBeCloseTo(0.005, 6);
  });

  it('when the rule set is validated, then the derived slope limit needs all six parameters in rad', () => {
    const broken = { ...V4, parameters: V4.parameters.filter((p) => p.name !== 'maxSlopePlain') };
    const v = validateRuleSet(broken);
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.issues.map((i) => i.message).join('\n')).toMatch(/maxSlopePlain/);
  });

  it('when both evaluators check the fixture, then they agree row by row', async () => {
    const input = loadCalc('two-bearing-gear-pulley.json');
    const result = evaluateValidInput(input);
    expect(await evaluateChecklist(input, result, V4)).toEqual(evaluateChecklistSync(input, result, V4));
  });
});

describe('demo data and impact of v4', () => {
  it.each([
    ['pump A', slurryPumpShaft()],
    ['pump B', slurryPumpShaft(50)],
    ['conveyor head', conveyorHeadShaft()],
    ['conveyor tail', conveyorHeadShaft(125)],
    ['agitator', mixerShaft()],
  ])(
    'when the demo %s shaft is checked against v4, then it is compliant with its moments from the model',
    (_name, raw) => {
      const input = valid(raw);
      expect(input.bending).toBeUndefined();
      const c = checklistSync(input, V4);
      expect(c.rows.filter((r) => r.status === 'error')).toEqual([]);
      expect(c.verdict).toBe('compliant');
      expect(c.rows.some((r) => r.location.scope === 'support')).toBe(true);
    },
  );

  it('when the v3-checked fixtures are re-checked against v4, then no row errors and only the advisory 3.2 is new for v1 files', () => {
    for (const f of ['five-segment-fatigue.json', 'hollow-si.json', 'solid-si.json', 'stepped-us.json']) {
      const [a, b] = [checklistSync(loadCalc(f), V3), checklistSync(loadCalc(f), V4)];
      expect(b.rows.filter((r) => r.status === 'error')).toEqual([]);
      expect(b.verdict).toBe(a.verdict);
      expect(
        b.rows
          .filter((r) => r.status === 'fail' && !a.rows.some((x) => x.clauseId === r.clauseId && x.status === 'fail'))
          .map((r) => r.clauseId),
      ).toEqual(['3.2']);
    }
  });
});
