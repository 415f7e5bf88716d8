import { niceAxis, niceStep, valueRange } from '../../../shared/plots';

describe('nice axis ticks', () => {
  it.each([
    [0.7, 0.5],
    [1, 1],
    [1.3, 1],
    [2.2, 2],
    [3, 2.5],
    [7, 5],
    [0.013, 0.01],
    [420, 500],
    [2400, 2500],
    [8, 10],
  ])('when the raw step is %p, then the nice step is %p', (raw, nice) => {
    expect(niceStep(raw)).toBeCloseTo(nice, 12);
  });

  it('when a shaft is 410 mm long, then the axis runs 0 to 450 in steps of 50', () => {
    const axis = niceAxis(0, 410, 8);
    expect(axis).toMatchObject({ min: 0, max: 450, step: 50 });
    expect(axis.ticks).toEqual([0, 50, 100, 150, 200, 250, 300, 350, 400, 450]);
  });

  it('when steps are decimal, then tick values carry no float noise', () => {
    const axis = niceAxis(0, 0.7, 7);
    expect(axis.ticks).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7]);
  });

  it('when the range crosses zero, then zero is a tick', () => {
    expect(niceAxis(-130, 160, 5).ticks).toContain(0);
  });

  it('when every value is the same or zero, then the axis is widened instead of collapsing', () => {
    expect(niceAxis(0, 0)).toMatchObject({ min: -1, max: 1 });
    const flat = niceAxis(150, 150);
    expect(flat.min).toBeLessThan(150);
    expect(flat.max).toBeGreaterThan(150);
  });

  it('when input is not finite, then the axis falls back to 0 to 1 and never shows NaN', () => {
    const axis = niceAxis(Number.NaN, Infinity);
    expect(axis).toMatchObject({ min: 0, max: 1 });
    expect(axis.ticks.every(Number.isFinite)).toBe(true);
  });

  it('when a range is asked to include zero, then it does, and non-finite values are skipped', () => {
    expect(valueRange([3, 8, Number.NaN], true)).toEqual([0, 8]);
    expect(valueRange([3, 8], false)).toEqual([3, 8]);
    expect(valueRange([], false)).toEqual([0, 1]);
  });
});
