import { formatNumber as f } from '../number-format';
import type { Model } from '../model';
import { BEAM_BASE, BEAM_LABELS } from './beam-units';
import type { PointLoad } from './resolve-loads';

/*
 * Axial reactions (magnitudes, N). The locating bearing takes the whole net axial load. With two
 * locating bearings (cross-located, e.g. a face-to-face pair) a load towards +x is taken by the
 * right-hand one and a load towards −x by the left-hand one. With none marked, the first bearing
 * takes it and a warning says so. Where a bearing with an axial load lacks X and Y, P = Fr is used
 * and a warning asks for the maker's factors.
 */
export function axialReactions(model: Model, loads: readonly PointLoad[]): number[] {
  const supports = model.input.supports ?? [];
  const out = supports.map(() => 0);
  const net = loads.reduce((s, l) => s + l.Fx, 0);
  if (Math.abs(net) <= 0) return out;
  const locating = supports
    .map((s, i) => ({ s, i }))
    .filter((e) => e.s.locating)
    .sort((a, b) => a.s.at - b.s.at);
  let taker: number;
  if (locating.length === 0) {
    taker = supports.map((s, i) => ({ s, i })).sort((a, b) => a.s.at - b.s.at)[0].i;
    model.warnings.push({
      path: 'supports',
      message: 'an axial load acts but no bearing is marked locating: the left-hand bearing is taken to carry it',
    });
  } else {
    taker = net > 0 ? locating[locating.length - 1].i : locating[0].i;
  }
  out[taker] = Math.abs(net);
  const s = supports[taker];
  if (s.kind !== 'plain' && s.C !== undefined && (s.X === undefined || s.Y === undefined)) {
    const unit = BEAM_LABELS[model.system].force;
    model.warnings.push({
      path: `supports[${taker}].X`,
      message: `bearing carries an axial load of ${f(Math.abs(net) / BEAM_BASE[model.system].force)} ${unit} but X and Y are not entered: P = Fr is used, which understates P`,
    });
  }
  return out;
}
