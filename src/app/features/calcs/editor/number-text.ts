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
 * A converted number to six significant digits: "3.93701 in", not "3.937007874 in", which was clipped
 * in narrow fields and claimed a precision no drawing has. Six digits change a result by under 1e-5;
 * switching back without editing restores exactly what was typed (unit-convert keeps the originals).
 */
export function convertedText(value: number): string {
  return formatNumber(value, 6);
}
