import type { Axis } from './plot-types';

// Steps of 1, 2, 2.5 and 5 per decade read easily on an engineering axis.
const NICE_FRACTIONS = [1, 2, 2.5, 5, 10];

/** The "nice" step (1, 2, 2.5, 5 × 10ⁿ) nearest to `raw` on a log scale, so the tick count stays near the target. */
export function niceStep(raw: number): number {
  if (!(raw > 0) || !Number.isFinite(raw)) return 1;
  const decade = 10 ** Math.floor(Math.log10(raw));
  const fraction = raw / decade;
  let nice = 1;
  for (const f of NICE_FRACTIONS) if (Math.abs(Math.log(f / fraction)) < Math.abs(Math.log(nice / fraction))) nice = f;
  return nice * decade;
}

// Multiples of a decimal step carry float noise (0.30000000000000004); round to the step's digits.
function clean(value: number, step: number): number {
  const digits = Math.max(0, 2 - Math.floor(Math.log10(step)));
  const v = Number(value.toFixed(Math.min(digits, 15)));
  return Object.is(v, -0) ? 0 : v;
}

/**
 * An axis covering [lo, hi] with about `target` intervals on nice numbers. A flat range (all values
 * equal, e.g. an unloaded shaft) is widened so the axis stays readable; non-finite input gives 0 to 1.
 */
export function niceAxis(lo: number, hi: number, target = 5): Axis {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return niceAxis(0, 1, target);
  if (lo > hi) [lo, hi] = [hi, lo];
  if (hi - lo < 1e-12 * Math.max(1, Math.abs(lo), Math.abs(hi))) {
    const pad = Math.abs(lo) > 0 ? Math.abs(lo) * 0.1 : 1;
    [lo, hi] = [lo - pad, hi + pad];
  }
  const step = niceStep((hi - lo) / Math.max(1, target));
  const min = clean(Math.floor(lo / step + 1e-9) * step, step);
  const max = clean(Math.ceil(hi / step - 1e-9) * step, step);
  const ticks: number[] = [];
  for (let i = 0, v = min; v <= max + step * 1e-6 && i < 100; i++, v = min + i * step) ticks.push(clean(v, step));
  return { min, max, step, ticks };
}

/** Axis bounds that include every y of the data, the limits and (for quantities drawn from an axis) zero. */
export function valueRange(values: readonly number[], includeZero: boolean): [number, number] {
  let lo = includeZero ? 0 : Infinity;
  let hi = includeZero ? 0 : -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return lo <= hi ? [lo, hi] : [0, 1];
}
