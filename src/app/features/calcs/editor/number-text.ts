import { formatNumber } from '../../../../../shared/engine';

// Plain decimal notation only: "0x10", "1,5" or "Infinity" stay text so the engine names the field.
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The calc-input value of a typed field: a number when the text is one, nothing when blank, and the
 * text itself otherwise, so the engine reports "must be a number, got the text …" at that field.
 */
export function fromText(text: string): number | string | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  return DECIMAL.test(t) && Number.isFinite(Number(t)) ? Number(t) : t;
}

/** The text shown for a stored value: numbers as typed, anything else as readable text. */
export function toText(value: unknown): string {
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'string') return value;
  return value === undefined || value === null ? '' : JSON.stringify(value);
}

/**
 * A converted number to ten significant digits. Seven looked tidier but turned 28 mm into 27.99999 mm
 * after a trip to inches and back; ten digits return every typed value exactly.
 */
export function convertedText(value: number): string {
  return formatNumber(value, 10);
}
