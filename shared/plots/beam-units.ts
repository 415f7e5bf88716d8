import { UNIT_LABELS } from '../engine/units';
import type { CalcResult } from '../engine';
import { BEAM_LABELS } from '../engine/beam/beam-units';

// What each whole-shaft result field is measured in, as beam-result.ts documents it, for a result
// whose `fields` do not (yet) list the field: forces N or lbf, moments as torques, slopes rad.
const KINDS: Record<string, (u: CalcResult['units']) => string> = {
  Fy: (u) => BEAM_LABELS[u].force,
  Fz: (u) => BEAM_LABELS[u].force,
  Fx: (u) => BEAM_LABELS[u].force,
  F: (u) => BEAM_LABELS[u].force,
  Fa: (u) => BEAM_LABELS[u].force,
  P: (u) => BEAM_LABELS[u].force,
  M: (u) => UNIT_LABELS[u].torque,
  My: (u) => UNIT_LABELS[u].torque,
  Mz: (u) => UNIT_LABELS[u].torque,
  deflection: (u) => UNIT_LABELS[u].length,
  at: (u) => UNIT_LABELS[u].length,
  slope: () => 'rad',
  L10: () => '10⁶ rev',
  L10h: () => 'h',
  rpm: () => 'rpm',
  totalMass: (u) => BEAM_LABELS[u].mass,
};

/** Unit of a whole-shaft result field: the engine's `fields` entry where there is one, else the documented unit. */
export function beamUnit(result: CalcResult, key: string): string {
  const own = result.fields[key]?.unit;
  if (own && own !== '1') return own;
  return KINDS[key]?.(result.units) ?? '';
}

/**
 * A force component with the solver's round-off removed: a pulley pulling along z comes out with
 * Fy = 3e-13 N, which would print as a number and draw as a stub of an arrow. Anything below a
 * billionth of the largest force in the result is shown as 0.
 */
export function forceCleaner(result: CalcResult): (v: number) => number {
  const all = [...result.supports, ...result.loads].flatMap((x) => [Math.abs(x.Fy), Math.abs(x.Fz)]);
  const floor = 1e-9 * Math.max(0, ...all);
  return (v) => (Math.abs(v) <= floor ? 0 : v);
}
