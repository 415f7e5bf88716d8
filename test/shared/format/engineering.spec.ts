import { formatBeside, formatEng, formatUtilisation, formatWithUnit, headlineMark } from '../../../shared/format';
import type { Checklist, RuleSet } from '../../../shared/rules';

describe('engineering number format', () => {
  it.each([
    [4.330708661, 4, '4.331'],
    [30.0228117, 4, '30.02'],
    [1500, 4, '1500'],
    [123456, 4, '123500'],
    [0.000123456, 3, '0.000123'],
    [2.5e-6, 3, '2.5×10⁻⁶'],
    [3.2e10, 3, '3.2×10¹⁰'],
    [0, 4, '0'],
    [-12.345, 3, '-12.3'],
  ])('when %p is shown with %p significant figures, then it reads %p', (value, sig, text) => {
    expect(formatEng(value, sig)).toBe(text);
  });

  it('when a value is missing or not finite, then it is a dash or ∞, never NaN', () => {
    expect([formatEng(null), formatEng(undefined), formatEng(Number.NaN), formatEng(Infinity)]).toEqual([
      '—',
      '—',
      '—',
      '∞',
    ]);
  });

  it('when a value is dimensionless (unit "1"), then no unit follows it: "2", not "2 1"', () => {
    expect(formatWithUnit(2, '1')).toBe('2');
    expect(formatWithUnit(12.5, 'MPa')).toBe('12.5 MPa');
  });

  it('when an actual of 1.497 sits below a limit of 1.5, then it prints 1.497, not 1.5', () => {
    expect(formatEng(1.497, 3)).toBe('1.5');
    expect(formatBeside(1.497, 1.5, 3)).toEqual({ actual: '1.497', limit: '1.5' });
    expect(formatBeside(1.5004, 1.5, 3)).toEqual({ actual: '1.5004', limit: '1.5' });
    expect(formatBeside(2.1, 1.5, 3)).toEqual({ actual: '2.1', limit: '1.5' });
  });

  it('when utilisation is just over 1, then it does not read "100 %"', () => {
    expect(formatUtilisation(1.5 / 1.497)).toBe('100.2 %');
    expect(formatUtilisation(0.9996)).toBe('99.96 %');
    expect(formatUtilisation(0.62)).toBe('62 %');
    expect(formatUtilisation(1)).toBe('100 %');
  });
});

describe('headline figures marked by their clause', () => {
  const ruleSet = {
    clauses: [
      {
        id: '5.3',
        severity: 'mandatory',
        measure: { actual: 'fatigueSafety', limit: 'param:minFatigueSafety', unit: '1', sense: 'at-least' },
      },
    ],
  } as unknown as RuleSet;
  const row = (actual: number, status: string) => ({
    clauseId: '5.3',
    severity: 'mandatory',
    status,
    actual,
    limit: 1.5,
    unit: '1',
    utilisation: 1.5 / actual,
  });
  const checklist = (rows: object[]) => ({ rows }) as unknown as Checklist;

  it('when the lowest fatigue safety 1.497 fails its 1.5 minimum, then the headline says so with the digits that show it', () => {
    expect(headlineMark(1.497, 'fatigueSafety', checklist([row(1.497, 'fail'), row(2.2, 'pass')]), ruleSet)).toEqual({
      outcome: 'fail',
      text: '1.497',
      limitText: 'min 1.5 (§5.3)',
    });
  });

  it('when every row passes, then it is marked as meeting the limit; with no clause it is unchecked', () => {
    expect(headlineMark(2.2, 'fatigueSafety', checklist([row(2.2, 'pass')]), ruleSet).outcome).toBe('pass');
    expect(headlineMark(2.2, 'twistTotal', checklist([row(2.2, 'pass')]), ruleSet)).toEqual({
      outcome: 'unchecked',
      text: '2.2',
      limitText: '',
    });
  });
});
