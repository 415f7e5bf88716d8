import { formatNumber } from '../../../../../shared/engine/number-format';

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

/**
 * "1e3" as the number it is ("1000"), so a typed exponent never sits in a field looking like a
 * label or a typo. Shifts the decimal point in the text itself (no float round trip), so the
 * digits shown are exactly the digits typed. Anything else (plain decimals, text, exponents
 * beyond ±30 that the engine names as out of range) gives null and is left as typed.
 */
export function plainDecimal(text: string): string | null {
  const m = /^([+-]?)(\d*)(?:\.(\d*))?[eE]([+-]?\d+)$/.exec(text.trim());
  if (!m || (m[2] === '' && !m[3]) || Math.abs(Number(m[4])) > 30) return null;
  const [, sign, whole, frac = '', exp] = m;
  const digits = `${whole}${frac}`;
  const point = whole.length + Number(exp);
  const padded = point <= 0 ? `${'0'.repeat(1 - point)}${digits}` : digits.padEnd(point, '0');
  const at = Math.max(point, 1);
  const int = padded.slice(0, at).replace(/^0+(?=\d)/, '');
  const dec = padded.slice(at).replace(/0+$/, '');
  return `${sign === '-' ? '-' : ''}${int}${dec ? `.${dec}` : ''}`;
}
