import type { CalcIssue } from '../issue-messages';
import type { CalcInput } from '../schema';
import { PLAUSIBLE_RANGES } from '../plausible-ranges';
import { BEAM_LABELS } from './beam-units';
import type { UnitSystem } from '../units';

/*
 * Plausible ranges of the v2 beam inputs, in the same spirit as check-ranges.ts: far wider than any
 * shaft needs, so no arithmetic of the beam model can overflow or vanish (common practice, no
 * source). Forces may also be exactly 0. Each US range contains the SI one converted.
 */
type Kind = 'force' | 'rating' | 'mass' | 'density';
const RANGES: Record<UnitSystem, Record<Kind, readonly [number, number]>> = {
  SI: { force: [1e-6, 1e9], rating: [1e-6, 1e6], mass: [1e-6, 1e6], density: [1, 30000] },
  US: { force: [1e-7, 3e8], rating: [1e-7, 3e8], mass: [1e-6, 3e6], density: [3e-5, 1.1] },
};

export function beamRanges(input: CalcInput): CalcIssue[] {
  const out: CalcIssue[] = [];
  const s = input.units;
  const unit = (k: Kind | 'length' | 'speed'): string =>
    k === 'length' ? (s === 'SI' ? 'mm' : 'in') : k === 'speed' ? 'rpm' : BEAM_LABELS[s][k];
  const check = (v: number | undefined, kind: Kind | 'length' | 'speed', path: string, signed = false): void => {
    if (v === undefined || (signed && v === 0)) return;
    const [lo, hi] = kind === 'length' || kind === 'speed' ? PLAUSIBLE_RANGES[s][kind] : RANGES[s][kind];
    const size = signed ? Math.abs(v) : v;
    if (size >= lo && size <= hi) return;
    out.push({
      path,
      message: `${v} ${unit(kind)} is outside the range this engine can compute reliably: ${signed ? 'its size must be 0 or ' : ''}from ${lo} to ${hi} ${unit(kind)}`,
    });
  };
  (input.supports ?? []).forEach((p, i) => check(p.C, 'rating', `supports[${i}].C`));
  (input.loads ?? []).forEach((l, i) => {
    for (const k of ['Fy', 'Fz', 'Fx'] as const)
      if (k in l) check((l as unknown as Record<string, number | undefined>)[k], 'force', `loads[${i}].${k}`, true);
    if ('pitchDiameter' in l) check(l.pitchDiameter, 'length', `loads[${i}].pitchDiameter`);
    if ('diameter' in l) check(l.diameter, 'length', `loads[${i}].diameter`);
  });
  (input.masses ?? []).forEach((m, i) => check(m.mass, 'mass', `masses[${i}].mass`));
  check(input.material.density, 'density', 'material.density');
  input.segments.forEach((g, i) => check(g.material?.density, 'density', `segments[${i}].material.density`));
  check(input.speed, 'speed', 'speed');
  return out;
}
