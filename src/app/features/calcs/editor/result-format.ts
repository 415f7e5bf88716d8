import { formatNumber } from '../../../../../shared/engine/number-format';
import type { CalcResult } from '../../../../../shared/engine';

/** A result number for a table: four significant digits; a missing value (no load) as a dash, never NaN. */
export function fmt(value: number | null | undefined, digits = 4): string {
  return typeof value === 'number' && Number.isFinite(value) ? formatNumber(value, digits) : '—';
}

/** Unit of a result field in brackets for a column header; dimensionless fields get none. */
export function unitOf(result: CalcResult, field: string): string {
  const u = result.fields[field]?.unit;
  return u && u !== '1' ? `[${u}]` : '';
}

export type CriterionKey = 'goodman' | 'asmeElliptic' | 'gerber' | 'soderberg';

export const CRITERION_KEYS: Record<string, CriterionKey> = {
  'DE-Goodman': 'goodman',
  'DE-ASME-elliptic': 'asmeElliptic',
  'DE-Gerber': 'gerber',
  'DE-Soderberg': 'soderberg',
};
