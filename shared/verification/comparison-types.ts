import type { Tolerances } from '../rules/verification-schema';

export type CompareValue = number | string | boolean | null;

/** Where a row sits, so a difference lands on the matching row of the editor, results or checklist. */
export type RowGroup =
  | 'material'
  | 'segment'
  | 'torque'
  | 'feature'
  | 'bending'
  | 'support'
  | 'load'
  | 'mass'
  | 'fatigue'
  | 'methods'
  | 'operation'
  | 'shaft'
  | 'reaction'
  | 'clause';

/**
 * One compared quantity. Values are in SI display units (mm, N·m, MPa, GPa, N, kN, kg, rpm, deg),
 * whatever unit system each model was entered in; null where a model has no such value.
 */
export interface ComparisonRow {
  /** Stable id: the input path (`segments[2].od`) or `result.<name>` / `clause.<id>@<scope>[i]`. */
  key: string;
  section: 'input' | 'result';
  group: RowGroup;
  label: string;
  unit: string;
  author: CompareValue;
  checker: CompareValue;
  /** |a − b| / max(|a|, |b|) for numbers; null otherwise. */
  relative: number | null;
  agrees: boolean;
}

export interface Comparison {
  agrees: boolean;
  tolerances: Tolerances;
  inputs: { compared: number; differences: number };
  results: { compared: number; differences: number };
  rows: ComparisonRow[];
}
