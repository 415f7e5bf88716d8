import fc from 'fast-check';
import { formatNumber } from '../../../shared/engine';
import { shortNumber } from '../../../shared/rules/short-number';

describe('shortNumber (message numbers)', () => {
  it.each([
    [0, '0'],
    [8.4271, '8.427'],
    [85.05, '85.05'],
    [113.4, '113.4'],
    [0.05, '0.05'],
    [0.000123456, '0.0001235'],
    [1000, '1000'],
    [99999, '100000'],
    [123456, '123500'],
    [-2.5, '-2.5'],
    [-0.00001, '-0.00001'],
    [2, '2'],
    [1e12, '1000000000000'],
  ])('when %p is shown, then it reads %p', (v, text) => {
    expect(shortNumber(v)).toBe(text);
    expect(formatNumber(v, 4)).toBe(text);
  });

  it('when any number in the working range is shown, then it equals the engine formatNumber except in the last digit of exact halves', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 1e9, noNaN: true }), fc.constantFrom(3, 4, 6), (v, d) => {
        const [mine, ref] = [shortNumber(v, d), formatNumber(v, d)];
        if (mine !== ref)
          expect(Math.abs(Number(mine) - Number(ref))).toBeLessThanOrEqual(
            1.0000001 * 10 ** (Math.floor(Math.log10(v)) - d + 1),
          );
        expect(Number.isFinite(Number(mine))).toBe(true);
      }),
      { numRuns: 5000, seed: 7 },
    );
  });
});
