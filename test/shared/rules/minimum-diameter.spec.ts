import { evaluateValidInput, validateCalcInput, type CalcInput } from '../../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, minimumDiameters, type RuleSet } from '../../../shared/rules';
import { loadCalc, only, shaft, STEEL_1045_CD, V3 } from './rules-helpers';

/** Whether every mandatory row the segment influences passes at outer diameter od (as the search judges). */
function passesAt(input: CalcInput, rs: RuleSet, index: number, od: number): boolean {
  const seg = input.segments[index];
  const v = validateCalcInput({
    ...input,
    segments: input.segments.map((s, i) => (i === index ? { ...s, od, id: (seg.id / seg.od) * od } : s)),
  });
  if (!v.ok) return false;
  const eff = applyRuleSetMethods(v.value, rs);
  const result = evaluateValidInput(eff);
  const { start, end } = result.segments[index];
  return evaluateChecklistSync(eff, result, rs)
    .rows.filter(
      (r) =>
        r.severity === 'mandatory' &&
        (r.location.scope === 'shaft' ||
          (r.location.scope === 'segment' && r.location.index === index) ||
          (r.location.scope === 'feature' && r.location.at! >= start && r.location.at! <= end)),
    )
    .every((r) => r.status === 'pass' || r.status === 'not-applicable');
}

describe('minimumDiameters', () => {
  it('when only the old ASME shear clause applies, then the minimum matches d = (16T/(π·τallow))^(1/3) [computed]', () => {
    // τallow = 113.4 MPa for 1045 CD (docs/references.md C-9); T = 1000 N·m.
    const [m] = minimumDiameters(shaft(50, 1000, STEEL_1045_CD), only(V3, ['4.1']));
    const expected = ((16 * 1000e3) / (Math.PI * 113.4)) ** (1 / 3);
    expect(m.status).toBe('found');
    expect(Math.abs(m.minimum! - expected) / expected).toBeLessThanOrEqual(2e-4);
    expect(m.governing).toMatchObject({ clauseId: '4.1', reference: 'KFD-ENG-014 v3 §4.1' });
    expect(m.governing!.utilisation!).toBeGreaterThan(0.999);
  });

  it('when the segment is hollow, then the bore ratio is kept and dₒ = (16T/(π·τ·(1 − k⁴)))^(1/3) [computed]', () => {
    const [m] = minimumDiameters(shaft(60, 1000, STEEL_1045_CD, {}, 30), only(V3, ['4.1']));
    const expected = ((16 * 1000e3) / (Math.PI * 113.4 * (1 - 0.5 ** 4))) ** (1 / 3);
    expect(Math.abs(m.minimum! - expected) / expected).toBeLessThanOrEqual(2e-4);
    expect(m.inner! / m.minimum!).toBeCloseTo(0.5, 12);
  });

  it('when searched on the five-segment shaft under KFD-ENG-014 v3, then each minimum passes and 0.5 % smaller fails', () => {
    const input = loadCalc('five-segment-fatigue.json');
    const found = minimumDiameters(input, V3);
    expect(found.map((m) => m.status)).toEqual(['found', 'found', 'found', 'found', 'found']);
    for (const m of found) {
      expect(passesAt(input, V3, m.segment, m.minimum!)).toBe(true);
      expect(passesAt(input, V3, m.segment, m.minimum! * 0.995)).toBe(false);
      expect(m.governing?.reference).toMatch(/^KFD-ENG-014 v3 §/);
    }
  });

  it('when a mandatory clause cannot pass at any diameter, then it reports none in range and names the clause', () => {
    // §3.1 requires fatigue data, which no diameter can supply.
    const [m] = minimumDiameters(shaft(50, 1000), only(V3, ['3.1', '4.1']));
    expect(m).toMatchObject({ status: 'none-in-range', minimum: null, governing: { clauseId: '3.1' } });
    expect(m.message).toMatch(/^no diameter within \[12\.50, 200\.0\] mm passes every mandatory clause$/);
  });

  it('when the lower end of the range already passes, then it says the minimum may be smaller', () => {
    const [m] = minimumDiameters(shaft(50, 1), only(V3, ['4.1']), { lo: 0.5 });
    expect(m.status).toBe('lower-end-passes');
    expect(m.minimum).toBeCloseTo(25, 9);
  });

  it('when the options are impossible, then it refuses them with the reason', () => {
    expect(() => minimumDiameters(shaft(50, 1), V3, { lo: 2, hi: 1 })).toThrow(/need 0 < lo < hi/);
  });
});
