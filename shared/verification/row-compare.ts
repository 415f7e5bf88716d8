import type { CompareValue, ComparisonRow, RowGroup } from './comparison-types';

/** Relative difference against the larger magnitude; two zeros are equal. */
export function relativeDifference(a: number, b: number): number {
  const scale = Math.max(Math.abs(a), Math.abs(b));
  return scale === 0 ? 0 : Math.abs(a - b) / scale;
}

// Floating-point noise from unit conversion (25.4, 6.894757…) must never count as a difference.
const ROUNDING = 1e-9;

export interface RowSpec {
  key: string;
  section: ComparisonRow['section'];
  group: RowGroup;
  label: string;
  unit: string;
}

/** One row: numbers within the tolerance agree; anything else must be identical (null only with null). */
export function compareRow(
  spec: RowSpec,
  author: CompareValue,
  checker: CompareValue,
  tolerance: number,
): ComparisonRow {
  if (typeof author === 'number' && typeof checker === 'number') {
    const relative = relativeDifference(author, checker);
    return { ...spec, author, checker, relative, agrees: relative <= tolerance + ROUNDING };
  }
  return { ...spec, author, checker, relative: null, agrees: author === checker };
}
