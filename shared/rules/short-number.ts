import { formatNumber } from '../engine';

const POW10 = Array.from({ length: 16 }, (_, k) => 10 ** k);

// Decimal text of the integer n scaled by 10^-k, trailing zeros dropped: (8427, 3) → "8.427".
function scaledText(n: number, k: number): string {
  let s = String(n);
  if (k <= 0) return k === 0 ? s : s + '0'.repeat(-k);
  if (s.length <= k) s = '0'.repeat(k - s.length + 1) + s;
  let end = s.length;
  while (end > s.length - k && s.charCodeAt(end - 1) === 48) end--;
  const point = s.length - k;
  return end === point ? s.slice(0, point) : `${s.slice(0, point)}.${s.slice(point, end)}`;
}

/**
 * `digits` significant digits for messages, like the engine's formatNumber but built from an
 * integer: number-to-text of doubles dominated checklist time (a checklist formats ~150 numbers).
 * A value exactly halfway in binary may round its last digit the other way; outside 1e-4 … 1e9
 * formatNumber is used.
 */
export function shortNumber(v: number, digits = 4): string {
  const a = Math.abs(v);
  if (!(a >= 1e-4 && a < 1e9)) return formatNumber(v, digits);
  const k = digits - 1 - Math.floor(Math.log10(a));
  const n = k >= 0 ? Math.round(a * POW10[k]) : Math.round(a / POW10[-k]);
  const text = scaledText(n, k);
  return v < 0 && text !== '0' ? `-${text}` : text;
}
