import {
  LIMIT_TOLERANCE,
  minimumDiameters,
  nearlyEqual,
  TOLERANT_OPERATORS,
  withinLimit,
  evaluateChecklistSync,
  applyRuleSetMethods,
} from '../../../shared/rules';
import { evaluateValidInput } from '../../../shared/engine';
import { outcomeOf } from '../../../shared/schemas/outcome';
import { checklistAsync, checklistSync, only, rowsOf, shaft, STEEL_1045_CD, V3 } from './rules-helpers';

/*
 * Issue 9, item 4: at exactly a limit, floating-point rounding must not decide the verdict. Check
 * value C-18 (docs/references.md): a solid 50 mm shaft of Sy = 530 MPa in pure torsion with
 * T = Sy·π·d³/(32·√3) has n_y = Sy/(√3·τ) = 2 by construction (Shigley 9th Eqs. 7-15, 7-16,
 * sourced); double-precision arithmetic gives 1.9999999999999996. The tolerance itself is common
 * practice, no source.
 */
const D = 50;
const T_AT_LIMIT = (STEEL_1045_CD.Sy * Math.PI * D ** 3) / (32 * Math.sqrt(3)) / 1000; // N·m
const YIELD_ONLY = only(V3, ['5.1']);

describe('comparing at a limit (one relative tolerance)', () => {
  it('when the yield safety is 2 by construction, then rounding leaves it a hair below 2 (the case to guard)', () => {
    const n = evaluateValidInput(shaft(D, T_AT_LIMIT)).segments[0].yieldSafety!;
    expect(Math.abs(n - 2)).toBeLessThan(1e-15);
  });

  it('when the yield safety equals the minimum 2 up to rounding, then the checklist row passes in both evaluators', async () => {
    const input = shaft(D, T_AT_LIMIT);
    for (const c of [checklistSync(input, YIELD_ONLY), await checklistAsync(input, YIELD_ONLY)]) {
      const [row] = rowsOf(c, '5.1');
      expect(row.status).toBe('pass');
      expect(row.utilisation).toBeCloseTo(1, 12);
      expect(row.message).toMatch(/meets the minimum of 2/);
    }
  });

  it('when the yield safety is 1e-6 below the minimum, then it still fails (the tolerance is far finer)', () => {
    const [row] = rowsOf(checklistSync(shaft(D, T_AT_LIMIT * (1 + 1e-6)), YIELD_ONLY), '5.1');
    expect(row.status).toBe('fail');
  });

  it('when the minimum diameter is searched from the present diameter that sits at the limit, then that diameter passes', () => {
    const [m] = minimumDiameters(shaft(D, T_AT_LIMIT), YIELD_ONLY, { lo: 1, hi: 2 });
    expect(m.status).toBe('lower-end-passes');
    expect(m.minimum).toBe(D);
  });

  it('when impact analysis re-evaluates the at-limit calc (evaluateChecklistSync + outcomeOf, as impact.service does), then nothing fails', () => {
    const input = applyRuleSetMethods(shaft(D, T_AT_LIMIT), YIELD_ONLY);
    expect(outcomeOf(evaluateChecklistSync(input, evaluateValidInput(input), YIELD_ONLY)).failing).toEqual([]);
  });

  it('when two numbers differ by less than the tolerance relative to the larger, then they count as equal; else not', () => {
    expect(LIMIT_TOLERANCE).toBe(1e-9);
    expect(nearlyEqual(1.9999999999999996, 2)).toBe(true);
    expect(nearlyEqual(2 * (1 - 5e-10), 2)).toBe(true);
    expect(nearlyEqual(2 * (1 - 2e-9), 2)).toBe(false);
    expect(nearlyEqual(0, 1e-300)).toBe(false);
    expect(withinLimit(1.9999999999999996, 2, false)).toBe(true);
    expect(withinLimit(2.0000000000000004, 2, true)).toBe(true);
    expect(withinLimit(2.01, 2, true)).toBe(false);
  });

  it('when the ordering operators meet nearly equal numbers, then inclusive ones pass and strict ones fail; other values compare exactly', () => {
    const { greaterThan, greaterThanInclusive, lessThan, lessThanInclusive } = TOLERANT_OPERATORS;
    expect([greaterThanInclusive(1.9999999999999996, 2), lessThanInclusive(2.0000000000000004, 2)]).toEqual([
      true,
      true,
    ]);
    expect([greaterThan(2.0000000000000004, 2), lessThan(1.9999999999999996, 2)]).toEqual([false, false]);
    expect([greaterThan(3, 2), lessThan(1, 2), greaterThanInclusive(1, 2)]).toEqual([true, true, false]);
    expect([greaterThan('3', 2), lessThanInclusive(null, 0)]).toEqual([true, true]);
  });
});
