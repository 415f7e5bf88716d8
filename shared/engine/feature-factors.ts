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
import {
  KEYSEAT_R_OVER_D,
  KEYSEAT_RD_TOLERANCE,
  RING_GROOVE_LIMITS,
  TABLE_7_1,
  tableMethod,
  type TableEntry,
} from './table-7-1';

export const PETERSON_METHOD =
  "Peterson torsion polynomial, stepped round shaft (Pilkey & Pilkey, Peterson's Stress Concentration Factors, 3rd ed.)";
export const NORTON_BENDING_METHOD =
  'Norton power-law fit Kt = A·(r/d)^b, bending rows interpolated in D/d (Norton, Machine Design, 2nd ed., App. E)';
export const NORTON_TORSION_METHOD =
  'Norton power-law fit Kts = A·(r/d)^b, torsion rows interpolated in D/d (Norton, Machine Design, 2nd ed., App. E)';

export interface Factors {
  Kt: number;
  Kts: number;
  ktMethod: string;
  ktsMethod: string;
}

const entered = (source: string | undefined): string => `entered by the author; source: ${source ?? 'not given'}`;

export type FilletKtsMethod = 'peterson' | 'norton';

function filletFactors(
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
      message: `r/d = ${f(rd)} is outside ${NORTON_RD_RANGE.join('–')}, the span of Norton's fillet charts; Kts from the fit is extrapolated`,
    });
  }
  return { Kt, Kts: tors.value, ktMethod: NORTON_BENDING_METHOD, ktsMethod: NORTON_TORSION_METHOD };
}

/*
 * Table 7-1 gives single values for typical proportions; say so when the feature is not typical
 * (issue 9, item 3). Keyseat values are for r/d = 0.02 (±10 %: common practice, no source); ring
 * grooves for standard retaining-ring grooves, depth up to 5 % of d with a root radius up to half
 * the depth (ring makers' proportions, from memory).
 */
function tableRangeWarning(ft: FeatureInput, g: FeatureGeometry, path: string, warn: CalcIssue[]): void {
  if (ft.type === 'keyseat' && Math.abs(g.r / g.d / KEYSEAT_R_OVER_D - 1) > KEYSEAT_RD_TOLERANCE) {
    warn.push({
      path,
      message:
        `the Table 7-1 keyseat factors are for a root radius r/d = ${KEYSEAT_R_OVER_D}; this keyseat has ` +
        `r/d = ${f(g.r / g.d, 3)}: enter Kt and Kts from a chart for this radius`,
    });
  }
  if (ft.type !== 'ring-groove') return;
  const depth = (g.seg.od - g.d) / 2;
  if (depth / g.seg.od > RING_GROOVE_LIMITS.depthOverD || g.r > RING_GROOVE_LIMITS.rOverDepth * depth) {
    warn.push({
      path,
      message:
        `the Table 7-1 ring-groove factors are for standard retaining-ring grooves (depth up to ` +
        `${100 * RING_GROOVE_LIMITS.depthOverD} % of d, root radius up to ${RING_GROOVE_LIMITS.rOverDepth} × depth); this groove has ` +
        `depth/d = ${f(depth / g.seg.od, 3)} and r/depth = ${f(g.r / depth, 3)}: enter Kt and Kts from a chart for its shape`,
    });
  }
}

function fromTable(entry: TableEntry): Factors {
  const method = tableMethod(entry);
  // A missing Kts (sled runner) is refused by validation unless entered, so 1 here is never reported.
  return { Kt: entry.Kt, Kts: entry.Kts ?? 1, ktMethod: method, ktsMethod: method };
}

function computed(
  ft: FeatureInput,
  g: FeatureGeometry,
  path: string,
  warn: CalcIssue[],
  ktsMethod: FilletKtsMethod,
): Factors {
  switch (ft.type) {
    case 'shoulder-fillet':
      return filletFactors(ft, g, path, warn, ktsMethod);
    case 'keyseat':
      tableRangeWarning(ft, g, path, warn);
      return fromTable(ft.form === 'end-mill' ? TABLE_7_1.endMillKeyseat : TABLE_7_1.sledRunnerKeyseat);
    case 'ring-groove':
      tableRangeWarning(ft, g, path, warn);
      return fromTable(TABLE_7_1.ringGroove);
    case 'cross-hole':
      return { Kt: 1, Kts: 1, ktMethod: '', ktsMethod: '' };
  }
}

/**
 * Kt and Kts of a feature with the method that gave each: the author's entered value (with its
 * source) wins; otherwise the default published method (docs/references.md) for the feature type.
 */
export function stressFactors(
  ft: FeatureInput,
  g: FeatureGeometry,
  path: string,
  warn: CalcIssue[],
  ktsMethod: FilletKtsMethod = 'peterson',
): Factors {
  const bothEntered = ft.Kt !== undefined && ft.Kts !== undefined;
  const c = bothEntered ? null : computed(ft, g, path, warn, ktsMethod);
  return {
    Kt: ft.Kt ?? c!.Kt,
    ktMethod: ft.Kt !== undefined ? entered(ft.source) : c!.ktMethod,
    Kts: ft.Kts ?? c!.Kts,
    ktsMethod: ft.Kts !== undefined ? entered(ft.source) : c!.ktsMethod,
  };
}
