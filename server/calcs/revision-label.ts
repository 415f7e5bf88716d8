/** Revision labels by the project's scheme: A, B … Z, AA, AB … or 0, 1, 2 … (seq starts at 0). */
export function revisionLabel(scheme: 'letters' | 'numbers', seq: number): string {
  if (scheme === 'numbers') return String(seq);
  let n = seq;
  let label = '';
  do {
    label = String.fromCharCode(65 + (n % 26)) + label;
    n = Math.floor(n / 26) - 1;
  } while (n >= 0);
  return label;
}
