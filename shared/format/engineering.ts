/*
 * Engineering number formatting, one set of rules for screens and reports (CSV keeps full precision):
 * a few significant figures, no unit "1" after a dimensionless value, and, beside a limit, enough
 * digits that the printed actual never seems to sit on the other side of the limit.
 */

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  0: '⁰',
  1: '¹',
  2: '²',
  3: '³',
  4: '⁴',
  5: '⁵',
  6: '⁶',
  7: '⁷',
  8: '⁸',
  9: '⁹',
};

/** `sig` significant figures, trailing zeros dropped; outside 1e-4 … 1e9 as "1.23×10⁻⁵". */
export function formatEng(value: number | null | undefined, sig = 4): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return value > 0 ? '∞' : '−∞';
  if (value === 0) return '0';
  const a = Math.abs(value);
  if (a >= 1e-4 && a < 1e9) return trimmed(value.toPrecision(sig));
  const [mantissa, exponent] = value.toExponential(sig - 1).split('e');
  return `${trimmed(mantissa)}×10${[...String(Number(exponent))].map((c) => SUPERSCRIPT[c]).join('')}`;
}

function trimmed(text: string): string {
  if (text.includes('e')) return String(Number(text));
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A unit to print after a number: none for dimensionless ("1") or empty units. */
export function unitText(unit: string | null | undefined): string {
  return unit && unit !== '1' && unit !== '–' ? unit : '';
}

/** "12.5 MPa", or "2" for a dimensionless value (never "2 1"). */
export function formatWithUnit(value: number | null | undefined, unit: string | null | undefined, sig = 4): string {
  const u = unitText(unit);
  const v = formatEng(value, sig);
  return u && v !== '—' ? `${v} ${u}` : v;
}

/**
 * Actual and limit as text, with as many more digits (up to 10) as it takes for the printed pair
 * to compare the way the numbers do: 1.497 against 1.5 prints "1.497", never "1.5" against "1.5".
 */
export function formatBeside(actual: number | null, limit: number | null, sig = 4): { actual: string; limit: string } {
  if (actual === null || limit === null || !Number.isFinite(actual) || !Number.isFinite(limit)) {
    return { actual: formatEng(actual, sig), limit: formatEng(limit, sig) };
  }
  let digits = sig;
  while (digits < 10 && Math.sign(round(actual, digits) - round(limit, digits)) !== Math.sign(actual - limit)) digits++;
  return { actual: formatEng(actual, digits), limit: formatEng(limit, digits) };
}

const round = (v: number, digits: number): number => (v === 0 ? 0 : Number(v.toPrecision(digits)));

/** Utilisation as a percentage that never reads "100 %" for a value just over or under the limit. */
export function formatUtilisation(utilisation: number | null): string {
  if (utilisation === null || !Number.isFinite(utilisation)) return '—';
  const pct = utilisation * 100;
  if (Math.abs(pct - 100) < 1e-9) return '100 %';
  let decimals = 0;
  while (decimals < 6 && Math.sign(Number(pct.toFixed(decimals)) - 100) !== Math.sign(pct - 100)) decimals++;
  return `${pct.toFixed(decimals)} %`;
}
