import type { FeatureGeometry } from './feature-geometry';
import {
  NORTON_BENDING,
  NORTON_RD_RANGE,
  NORTON_TORSION,
  nortonFit,
  nortonRdInRange,
  petersonInRange,
  petersonTorsion,
} from './fillet-factors';
import type { CalcIssue } from './issue-messages';
import { formatNumber as f } from './number-format';
import type { FeatureInput } from './schema';

/** Kt and Kts of a feature with the method that gave each. */
export interface Factors {
  Kt: number;
  Kts: number;
  ktMethod: string;
  ktsMethod: string;
}

export const PETERSON_METHOD =
  "Peterson torsion polynomial, stepped round shaft (Pilkey & Pilkey, Peterson's Stress Concentration Factors, 3rd ed.)";
export const NORTON_BENDING_METHOD =
  'Norton power-law fit Kt = A·(r/d)^b, bending rows interpolated in D/d (Norton, Machine Design, 2nd ed., App. E)';
export const NORTON_TORSION_METHOD =
  'Norton power-law fit Kts = A·(r/d)^b, torsion rows interpolated in D/d (Norton, Machine Design, 2nd ed., App. E)';

export type FilletKtsMethod = 'peterson' | 'norton';

/**
 * Kt and Kts of a shoulder fillet: Kt from Norton's bending fit; Kts from the Peterson torsion polynomial within
 * its range, else (or when the standard chooses it) from Norton's torsion fit; a warning wherever a fit is stretched.
 */
export function filletFactors(
  ft: FeatureInput,
  g: FeatureGeometry,
  path: string,
  warn: CalcIssue[],
  ktsMethod: FilletKtsMethod,
): Factors {
  const D = g.D ?? g.d;
  const rd = g.r / g.d;
  const bend = nortonFit(NORTON_BENDING, D / g.d, rd);
  if (bend.isClamped)
    warn.push({
      path,
      message: `D/d = ${f(D / g.d)} is outside the Norton bending rows 1.01–6; the nearest row gives Kt`,
    });
  if (!nortonRdInRange(rd) && ft.Kt === undefined) {
    warn.push({
      path,
      message:
        `r/d = ${f(rd)} is outside ${NORTON_RD_RANGE.join('–')}, the span of Norton's fillet charts; ` +
        'Kt from the fit is extrapolated: enter Kt from a chart that covers this radius',
    });
  }
  const tr = (D - g.d) / 2 / g.r;
  if (ktsMethod === 'norton') return nortonTorsion(ft, g, D, rd, path, warn, bend.value);
  if (petersonInRange(tr)) {
    return {
      Kt: bend.value,
      Kts: petersonTorsion(D, g.d, g.r),
      ktMethod: NORTON_BENDING_METHOD,
      ktsMethod: PETERSON_METHOD,
    };
  }
  // Never extrapolate the polynomial: fall back to the other published fit and say so.
  const tors = nortonFit(NORTON_TORSION, D / g.d, rd);
  warn.push({
    path,
    message:
      `t/r = ${f(tr)} is outside the Peterson polynomial's range 0.25–4; Kts comes from the Norton ` +
      `torsion fit instead${tors.isClamped ? ` at its nearest row (D/d = ${f(D / g.d)} is outside 1.09–2)` : ''}; ` +
      'consider entering Kts from a chart',
  });
  return { Kt: bend.value, Kts: tors.value, ktMethod: NORTON_BENDING_METHOD, ktsMethod: NORTON_TORSION_METHOD };
}

/** Norton's torsion fit, when a standard chooses it (or no longer only as the Peterson fallback). */
function nortonTorsion(
  ft: FeatureInput,
  g: FeatureGeometry,
  D: number,
  rd: number,
  path: string,
  warn: CalcIssue[],
  Kt: number,
): Factors {
  const tors = nortonFit(NORTON_TORSION, D / g.d, rd);
  if (tors.isClamped)
    warn.push({
      path,
      message: `D/d = ${f(D / g.d)} is outside the Norton torsion rows 1.09–2; the nearest row gives Kts`,
    });
  if (!nortonRdInRange(rd) && ft.Kts === undefined) {
    warn.push({
      path,
      message:
        `r/d = ${f(rd)} is outside ${NORTON_RD_RANGE.join('–')}, the span of Norton's fillet charts; ` +
        'Kts from the fit is extrapolated',
    });
  }
  return { Kt, Kts: tors.value, ktMethod: NORTON_BENDING_METHOD, ktsMethod: NORTON_TORSION_METHOD };
}
