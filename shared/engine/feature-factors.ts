import type { FeatureGeometry } from './feature-geometry';
import { NORTON_BENDING, NORTON_TORSION, nortonFit, petersonInRange, petersonTorsion } from './fillet-factors';
import type { CalcIssue } from './issue-messages';
import { formatNumber as f } from './number-format';
import type { FeatureInput } from './schema';
import { TABLE_7_1, tableMethod, type TableEntry } from './table-7-1';

export const PETERSON_METHOD = "Peterson torsion polynomial, stepped round shaft (Pilkey & Pilkey, Peterson's Stress Concentration Factors, 3rd ed.)";
export const NORTON_BENDING_METHOD = 'Norton power-law fit Kt = A·(r/d)^b, bending rows interpolated in D/d (Norton, Machine Design, 2nd ed., App. E)';
export const NORTON_TORSION_METHOD = 'Norton power-law fit Kts = A·(r/d)^b, torsion rows interpolated in D/d (Norton, Machine Design, 2nd ed., App. E)';

export interface Factors {
  Kt: number; Kts: number; ktMethod: string; ktsMethod: string;
}

const entered = (source: string | undefined): string => `entered by the author; source: ${source ?? 'not given'}`;

export type FilletKtsMethod = 'peterson' | 'norton';

function filletFactors(g: FeatureGeometry, path: string, warn: CalcIssue[], ktsMethod: FilletKtsMethod): Factors {
  const D = g.D ?? g.d;
  const rd = g.r / g.d;
  const bend = nortonFit(NORTON_BENDING, D / g.d, rd);
  if (bend.isClamped) warn.push({ path, message: `D/d = ${f(D / g.d)} is outside the Norton bending rows 1.01–6; the nearest row gives Kt` });
  const tr = (D - g.d) / 2 / g.r;
  if (ktsMethod === 'norton') return nortonTorsion(g, D, rd, path, warn, bend.value);
  if (petersonInRange(tr)) {
    return { Kt: bend.value, Kts: petersonTorsion(D, g.d, g.r), ktMethod: NORTON_BENDING_METHOD, ktsMethod: PETERSON_METHOD };
  }
  // Never extrapolate the polynomial: fall back to the other published fit and say so.
  const tors = nortonFit(NORTON_TORSION, D / g.d, rd);
  warn.push({ path, message: `t/r = ${f(tr)} is outside the Peterson polynomial's range 0.25–4; Kts comes from the Norton `
    + `torsion fit instead${tors.isClamped ? ` at its nearest row (D/d = ${f(D / g.d)} is outside 1.09–2)` : ''}; `
    + 'consider entering Kts from a chart' });
  return { Kt: bend.value, Kts: tors.value, ktMethod: NORTON_BENDING_METHOD, ktsMethod: NORTON_TORSION_METHOD };
}

/** Norton's torsion fit, when a standard chooses it (or no longer only as the Peterson fallback). */
function nortonTorsion(g: FeatureGeometry, D: number, rd: number, path: string, warn: CalcIssue[], Kt: number): Factors {
  const tors = nortonFit(NORTON_TORSION, D / g.d, rd);
  if (tors.isClamped) warn.push({ path, message: `D/d = ${f(D / g.d)} is outside the Norton torsion rows 1.09–2; the nearest row gives Kts` });
  return { Kt, Kts: tors.value, ktMethod: NORTON_BENDING_METHOD, ktsMethod: NORTON_TORSION_METHOD };
}

function fromTable(entry: TableEntry): Factors {
  const method = tableMethod(entry);
  // A missing Kts (sled runner) is refused by validation unless entered, so 1 here is never reported.
  return { Kt: entry.Kt, Kts: entry.Kts ?? 1, ktMethod: method, ktsMethod: method };
}

function computed(ft: FeatureInput, g: FeatureGeometry, path: string, warn: CalcIssue[], ktsMethod: FilletKtsMethod): Factors {
  switch (ft.type) {
    case 'shoulder-fillet': return filletFactors(g, path, warn, ktsMethod);
    case 'keyseat': return fromTable(ft.form === 'end-mill' ? TABLE_7_1.endMillKeyseat : TABLE_7_1.sledRunnerKeyseat);
    case 'ring-groove': return fromTable(TABLE_7_1.ringGroove);
    case 'cross-hole': return { Kt: 1, Kts: 1, ktMethod: '', ktsMethod: '' };
  }
}

/**
 * Kt and Kts of a feature with the method that gave each: the author's entered value (with its
 * source) wins; otherwise the default published method (REFERENCES.md) for the feature type.
 */
export function stressFactors(ft: FeatureInput, g: FeatureGeometry, path: string, warn: CalcIssue[], ktsMethod: FilletKtsMethod = 'peterson'): Factors {
  const bothEntered = ft.Kt !== undefined && ft.Kts !== undefined;
  const c = bothEntered ? null : computed(ft, g, path, warn, ktsMethod);
  return {
    Kt: ft.Kt ?? c!.Kt, ktMethod: ft.Kt !== undefined ? entered(ft.source) : c!.ktMethod,
    Kts: ft.Kts ?? c!.Kts, ktsMethod: ft.Kts !== undefined ? entered(ft.source) : c!.ktsMethod,
  };
}
