import { momentAt } from '../bending-diagram';
import type { Model } from '../model';

/*
 * Bending at a station for the stress checks: the beam model's resultant moment M (rotating shaft
 * under steady transverse loads, so fully reversed: Ma = M, Mm = 0; Shigley 9th §7-4) plus any
 * author-entered Ma, Mm added on top as magnitudes (their direction is unknown, so adding is the
 * conservative choice). All N·mm.
 */
export interface Bending {
  Ma: number;
  Mm: number;
  M: number;
}

/** Resultant model moment at x; where the diagram jumps (a couple) the larger side. */
export function modelMoment(model: Model, x: number): number {
  const d = model.beam?.diagram;
  if (!d || !d.length) return 0;
  if (x <= d[0].at) return Math.hypot(d[0].My, d[0].Mz);
  if (x >= d[d.length - 1].at) return Math.hypot(d[d.length - 1].My, d[d.length - 1].Mz);
  let lo = 0;
  let hi = d.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (d[mid].at < x) lo = mid;
    else hi = mid;
  }
  let best = 0;
  for (let i = hi; i < d.length && d[i].at === x; i++) best = Math.max(best, Math.hypot(d[i].My, d[i].Mz));
  if (d[hi].at === x) return best;
  const [a, b] = [d[lo], d[hi]];
  const s = (x - a.at) / (b.at - a.at);
  return Math.hypot(a.My + s * (b.My - a.My), a.Mz + s * (b.Mz - a.Mz));
}

export function bendingAt(model: Model, x: number): Bending {
  const hand = momentAt(model.moments, x);
  const M = modelMoment(model, x);
  return { Ma: M + hand.Ma, Mm: hand.Mm, M };
}

/** Stations where the bending can peak: the entered ones and the model's diagram stations (mm, sorted). */
export function bendingStations(model: Model): number[] {
  const xs = [...model.moments.map((m) => m.at), ...(model.beam?.diagram ?? []).map((d) => d.at)].sort((a, b) => a - b);
  return xs.filter((x, i) => i === 0 || x !== xs[i - 1]);
}
