import type { SupportKind } from './beam-schema';

/*
 * Basic rating life, ISO 281:2007 §6 (from memory): L10 = (C/P)^p in millions of revolutions,
 * p = 3 for ball bearings and 10/3 for roller bearings; L10h = 10⁶·L10/(60·n). P = X·Fr + Y·Fa with
 * the maker's X and Y where there is an axial load, else P = Fr. A plain bearing has no rating life.
 */
export const LIFE_METHOD = 'L10 = (C/P)^p, p = 3 ball, 10/3 roller; L10h = 10⁶·L10/(60·n); P = X·Fr + Y·Fa (ISO 281)';

const EXPONENT: Record<SupportKind, number | null> = {
  'deep-groove-ball': 3,
  'self-aligning-ball': 3,
  'cylindrical-roller': 10 / 3,
  'tapered-roller': 10 / 3,
  'spherical-roller': 10 / 3,
  plain: null,
};

export function lifeExponent(kind: SupportKind): number | null {
  return EXPONENT[kind];
}

export interface Life {
  P: number;
  L10: number | null;
  L10h: number | null;
}

/** Life from C and P in the same force unit; null where it cannot be stated (no C, plain, no load). */
export function ratingLife(
  kind: SupportKind,
  C: number | null,
  Fr: number,
  Fa: number,
  X: number | undefined,
  Y: number | undefined,
  rpm: number | null,
): Life {
  const P = Fa > 0 && X !== undefined && Y !== undefined ? X * Fr + Y * Fa : Fr;
  const p = EXPONENT[kind];
  if (C === null || p === null || !(P > 0)) return { P, L10: null, L10h: null };
  const L10 = (C / P) ** p;
  if (!Number.isFinite(L10)) return { P, L10: null, L10h: null };
  return { P, L10, L10h: rpm ? (L10 * 1e6) / (60 * rpm) : null };
}
