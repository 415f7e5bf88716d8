import type { CalcInput } from '../engine';
import type { Comparison, ComparisonRow } from './comparison-types';
import { compareInputs } from './compare-inputs';
import { compareResults, type ModelRecord } from './compare-results';
import type { Tolerances } from '../rules/verification-schema';

const count = (rows: ComparisonRow[]) => ({ compared: rows.length, differences: rows.filter((r) => !r.agrees).length });

/**
 * The author's model against the checker's independent one, within the standard's tolerances.
 * Pure and deterministic (same rows in the same order), so its hash can be signed.
 */
export function compareModels(
  author: { input: CalcInput } & ModelRecord,
  checker: { input: CalcInput } & ModelRecord,
  tolerances: Tolerances,
): Comparison {
  const inputs = compareInputs(author.input, checker.input, tolerances.inputs);
  const results = compareResults(author, checker, tolerances.results);
  const rows = [...inputs, ...results];
  return { agrees: rows.every((r) => r.agrees), tolerances, inputs: count(inputs), results: count(results), rows };
}

/** The differences as a reviewer reads them: "Segment 3 outer diameter: author 60 mm, checker 62 mm (3.2 %)". */
export function describeDifference(r: ComparisonRow): string {
  const show = (v: ComparisonRow['author']) =>
    v === null ? 'none' : typeof v === 'number' ? `${+v.toPrecision(5)}${r.unit ? ` ${r.unit}` : ''}` : String(v);
  const rel = r.relative === null ? '' : ` (differs by ${+(r.relative * 100).toPrecision(3)} %)`;
  return `${r.label}: author's model ${show(r.author)}, independent model ${show(r.checker)}${rel}`;
}
