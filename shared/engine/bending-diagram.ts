import type { MomentEntry } from './model';

/*
 * Bending moments between the entered stations are interpolated linearly (a moment diagram from
 * point loads is piecewise linear between them). Beyond the first and last entry the nearest value
 * is held, not extrapolated: the engine does not know where the bearings are, and holding is the
 * conservative choice. With no entries the shaft is in torsion only. Results are magnitudes.
 */
export interface Moments {
  Ma: number;
  Mm: number;
}

export function momentAt(entries: readonly MomentEntry[], x: number): Moments {
  const n = entries.length;
  if (n === 0) return { Ma: 0, Mm: 0 };
  if (x <= entries[0].at) return { Ma: Math.abs(entries[0].Ma), Mm: Math.abs(entries[0].Mm) };
  if (x >= entries[n - 1].at) return { Ma: Math.abs(entries[n - 1].Ma), Mm: Math.abs(entries[n - 1].Mm) };
  let i = 1;
  while (entries[i].at < x) i++;
  const a = entries[i - 1];
  const b = entries[i];
  const s = (x - a.at) / (b.at - a.at);
  return { Ma: Math.abs(a.Ma + s * (b.Ma - a.Ma)), Mm: Math.abs(a.Mm + s * (b.Mm - a.Mm)) };
}
