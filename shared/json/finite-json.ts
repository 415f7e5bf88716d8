import { indexPath, keyPath } from './json-value-check';

/**
 * The path of the first Infinity or NaN in a value built by code (a result), or null. Values are almost always
 * finite: a walk that builds no paths answers those, and only a value that has one is walked again for its path.
 */
export function nonFinitePath(value: unknown): string | null {
  return allFinite(value) ? null : firstNonFinitePath(value);
}

function allFinite(v: unknown): boolean {
  if (typeof v === 'number') return Number.isFinite(v);
  if (v === null || typeof v !== 'object') return true;
  if (Array.isArray(v)) return v.every(allFinite);
  return Object.values(v).every(allFinite);
}

function firstNonFinitePath(value: unknown): string | null {
  const stack: [unknown, string][] = [[value, '']];
  while (stack.length > 0) {
    const [v, path] = stack.pop()!;
    if (typeof v === 'number' && !Number.isFinite(v)) return path;
    if (v === null || typeof v !== 'object') continue;
    if (Array.isArray(v)) for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], indexPath(path, i)]);
    else for (const [k, x] of Object.entries(v).reverse()) stack.push([x, keyPath(path, k)]);
  }
  return null;
}

/**
 * JSON.stringify for what is stored: it would write Infinity and NaN as null, silently turning
 * "cannot be computed" into "no value". Throws instead; callers check with nonFinitePath first.
 */
export function stringifyFinite(value: unknown): string {
  const bad = nonFinitePath(value);
  if (bad !== null) throw new Error(`refusing to store a non-finite number at ${bad || '(root)'}`);
  return JSON.stringify(value);
}
