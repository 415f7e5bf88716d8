import type { FeatureGeometry } from './feature-geometry';
import { filletFactors, type Factors, type FilletKtsMethod } from './fillet-stress-factors';
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

export type { Factors, FilletKtsMethod } from './fillet-stress-factors';

const entered = (source: string | undefined): string => `entered by the author; source: ${source ?? 'not given'}`;

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
        `${100 * RING_GROOVE_LIMITS.depthOverD} % of d, root radius up to ${RING_GROOVE_LIMITS.rOverDepth} × depth); ` +
        `this groove has depth/d = ${f(depth / g.seg.od, 3)} and r/depth = ${f(g.r / depth, 3)}: ` +
        'enter Kt and Kts from a chart for its shape',
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
