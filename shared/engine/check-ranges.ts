import type { CalcIssue } from './issue-messages';
import { fieldOf } from './issue-fields';
import { formatNumber as f } from './number-format';
import { torqueFromPower } from './power';
import type { CalcInput, MaterialInput } from './schema';
import type { UnitSystem } from './units';
import { PLAUSIBLE_RANGES, type RangeKind } from './plausible-ranges';

// Refuses, naming the field, any calc input outside the plausible ranges (plausible-ranges.ts says why they exist).

const SIGNED = new Set<RangeKind>(['torque', 'power']);

interface Ctx {
  system: UnitSystem;
  out: CalcIssue[];
}

// Range ends read best as 1e-6 and 1e+10 rather than 0.000001 and 10000000000.
function g(v: number): string {
  const a = Math.abs(v);
  return a !== 0 && (a < 1e-3 || a >= 1e6) ? Number(v.toPrecision(6)).toExponential().replace('e+', 'e') : f(v);
}

function check(value: number | undefined, kind: RangeKind, path: string, c: Ctx): void {
  if (value === undefined) return;
  const [lo, hi] = PLAUSIBLE_RANGES[c.system][kind];
  const size = SIGNED.has(kind) ? Math.abs(value) : value;
  if ((size >= lo && size <= hi) || (SIGNED.has(kind) && value === 0)) return;
  const key = path.slice(path.lastIndexOf('.') + 1);
  const { name, unit } = fieldOf([key], c.system);
  const what = SIGNED.has(kind)
    ? `its size must be 0 or from ${g(lo)} to ${g(hi)}${unit}`
    : `the plausible range is ${g(lo)} to ${g(hi)}${unit}`;
  c.out.push({
    path,
    message: `${name} ${g(value)}${unit} is outside the range this engine can compute reliably: ${what}`,
  });
}

function material(m: MaterialInput | undefined, p: string, c: Ctx): void {
  if (!m) return;
  for (const k of ['E', 'G'] as const) check(m[k], 'modulus', `${p}.${k}`, c);
  for (const k of ['Sy', 'Su'] as const) check(m[k], 'stress', `${p}.${k}`, c);
}

function features(input: CalcInput, c: Ctx): void {
  (input.features ?? []).forEach((ft, i) => {
    const p = `features[${i}]`;
    for (const k of ['r', 'width', 'height', 'length', 'depth', 'diameter'] as const) {
      const v = (ft as unknown as Record<string, unknown>)[k];
      if (typeof v === 'number') check(v, 'length', `${p}.${k}`, c);
    }
    check(ft.Kt, 'Kt', `${p}.Kt`, c);
    check(ft.Kts, 'Kt', `${p}.Kts`, c);
    if (ft.type === 'keyseat') check(ft.Sy, 'stress', `${p}.Sy`, c);
  });
}

// T = P/ω of a power entry must itself be a plausible torque; the speed is usually what is off.
function powerTorque(input: CalcInput, i: number, c: Ctx): void {
  const t = input.torques[i];
  if ('T' in t || t.power === 0) return;
  const T = Math.abs(torqueFromPower(t.power, t.speed, c.system));
  const [lo, hi] = PLAUSIBLE_RANGES[c.system].torque;
  if (T >= lo && T <= hi) return;
  const u = fieldOf(['T'], c.system).unit;
  c.out.push({
    path: `torques[${i}].speed`,
    message:
      `power ${g(t.power)}${fieldOf(['power'], c.system).unit} at ${f(t.speed)} rpm ` +
      `means a torque of ${g(T)}${u}, outside ${g(lo)} to ${g(hi)}${u}: check the speed and the power`,
  });
}

function loads(input: CalcInput, c: Ctx): void {
  input.torques.forEach((t, i) => {
    const p = `torques[${i}]`;
    check(t.Ta, 'torque', `${p}.Ta`, c);
    if ('T' in t) {
      check(t.T, 'torque', `${p}.T`, c);
      return;
    }
    const before = c.out.length;
    check(t.power, 'power', `${p}.power`, c);
    check(t.speed, 'speed', `${p}.speed`, c);
    if (c.out.length === before) powerTorque(input, i, c);
  });
  (input.bending ?? []).forEach((b, i) => {
    check(b.Ma, 'torque', `bending[${i}].Ma`, c);
    check(b.Mm, 'torque', `bending[${i}].Mm`, c);
  });
}

function fatigue(input: CalcInput, c: Ctx): void {
  const fat = input.fatigue;
  if (!fat) return;
  check(fat.temperature, 'temperature', 'fatigue.temperature', c);
  for (const k of ['kc', 'kd', 'kf'] as const) check(fat[k], 'factor', `fatigue.${k}`, c);
  check(fat.alternatingTorqueFraction, 'fraction', 'fatigue.alternatingTorqueFraction', c);
  check(fat.SePrime, 'stress', 'fatigue.SePrime', c);
}

/**
 * Refuses entries outside the plausible range of their quantity (item 7 of issue 9), before any
 * cross-field check does arithmetic with them. Each issue names the field, the value with its unit
 * and the range.
 */
export function checkRanges(input: CalcInput): CalcIssue[] {
  const c: Ctx = { system: input.units, out: [] };
  material(input.material, 'material', c);
  input.segments.forEach((s, i) => {
    const p = `segments[${i}]`;
    check(s.length, 'length', `${p}.length`, c);
    check(s.od, 'length', `${p}.od`, c);
    if (s.id > 0) check(s.id, 'length', `${p}.id`, c);
    // A wall thinner than the smallest plausible length makes J the difference of two nearly equal numbers.
    const wall = (s.od - s.id) / 2;
    if (s.id > 0 && s.id < s.od && wall < PLAUSIBLE_RANGES[c.system].length[0]) {
      c.out.push({
        path: `${p}.id`,
        message: `the wall (od − id)/2 = ${f(wall)}${fieldOf(['id'], c.system).unit} is thinner than this engine can compute reliably`,
      });
    }
    material(s.material, `${p}.material`, c);
  });
  loads(input, c);
  features(input, c);
  fatigue(input, c);
  return c.out;
}
