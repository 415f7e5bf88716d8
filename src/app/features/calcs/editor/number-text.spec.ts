import { fromText, plainDecimal } from './number-text';

describe('a typed exponent is shown as the number it is', () => {
  it.each([
    ['1e3', '1000'],
    ['1E3', '1000'],
    ['2.5e-3', '0.0025'],
    ['-1.2e+2', '-120'],
    ['.5e1', '5'],
    ['12.50e1', '125'],
    ['7e0', '7'],
    ['1.25e-1', '0.125'],
    ['0.0004e4', '4'],
  ])('when "%s" is typed, then the field shows %s and the value is unchanged', (typed, shown) => {
    expect(plainDecimal(typed)).toBe(shown);
    expect(fromText(shown)).toBe(fromText(typed));
  });

  it.each(['1000', '12.5', 'abc', '1,5e3', 'e3', '1e', '1e400', '1e-400', ''])(
    'when "%s" is typed, then it is left as typed',
    (typed) => {
      expect(plainDecimal(typed)).toBeNull();
    },
  );
});
