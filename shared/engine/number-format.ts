/** Compact human form of a number for messages and tables: six significant digits, no trailing zeros. */
export function formatNumber(value: number, digits = 6): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  return String(Number(value.toPrecision(digits)));
}

/** `segments[1].id` from a path array. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out ? `.${String(key)}` : String(key);
  }
  return out || '(input)';
}
