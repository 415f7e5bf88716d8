/*
 * Checks on an already-parsed JSON value (a request body, a stored document): size and depth limits,
 * keys that reach a prototype, lone UTF-16 surrogates and numbers beyond storage; and the field paths
 * (`segments[0].od`) its issues use. strict-json.ts says why each is refused.
 */
export interface JsonIssue {
  path: string;
  message: string;
}

export interface JsonLimits {
  /** Levels of objects and arrays; Torquetrail's own documents need fewer than 10. */
  maxDepth: number;
  /** Values in the whole document (objects, arrays, strings, numbers, ...). */
  maxNodes: number;
}

export const JSON_LIMITS: Readonly<JsonLimits> = { maxDepth: 32, maxNodes: 200_000 };

/** Keys that would reach an object's prototype when code builds objects from user keys. */
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export const keyPath = (parent: string, key: string): string => (parent ? `${parent}.${key}` : key);
export const indexPath = (parent: string, index: number): string => `${parent}[${index}]`;

/** True when the text holds a UTF-16 surrogate without its partner (not representable in UTF-8). */
export function hasLoneSurrogate(text: string): boolean {
  return LONE_SURROGATE.test(text);
}

function keyProblem(key: string): string | null {
  if (FORBIDDEN_KEYS.has(key)) return 'is not an accepted field name';
  if (hasLoneSurrogate(key)) return 'is a field name with invalid text (a lone surrogate); nothing was changed';
  return null;
}

function leafProblem(value: unknown): string | null {
  if (typeof value === 'number' && !Number.isFinite(value))
    return 'is a number beyond the range that can be stored (±1.8e308)';
  if (typeof value === 'string' && hasLoneSurrogate(value))
    return 'contains invalid text (a lone surrogate); nothing was changed';
  return null;
}

export type Part = string | number;
export const pathText = (parts: readonly Part[], root: string): string =>
  parts.reduce<string>((acc, k) => (typeof k === 'number' ? indexPath(acc, k) : keyPath(acc, k)), root);

/**
 * Checks an already-parsed value (a request body, a stored document) against the limits above.
 * Iterative, so a document nested beyond any limit cannot overflow the stack while being checked.
 * `parts` is the same path as `path`, as zod wants it for an issue.
 */
export function jsonValueProblem(
  value: unknown,
  limits: JsonLimits = JSON_LIMITS,
  root = '',
): (JsonIssue & { parts: Part[] }) | null {
  const stack: [unknown, Part[]][] = [[value, []]];
  let nodes = 0;
  const problem = (parts: Part[], message: string) => ({ path: pathText(parts, root), parts, message });
  while (stack.length > 0) {
    const [v, parts] = stack.pop()!;
    if (++nodes > limits.maxNodes) return problem([], `holds more than ${limits.maxNodes} values`);
    if (v === null || typeof v !== 'object') {
      const leaf = leafProblem(v);
      if (leaf) return problem(parts, leaf);
      continue;
    }
    if (parts.length >= limits.maxDepth) return problem(parts, `is nested deeper than ${limits.maxDepth} levels`);
    if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], [...parts, i]]);
      continue;
    }
    const keys = Object.keys(v);
    for (let i = keys.length - 1; i >= 0; i--) {
      const bad = keyProblem(keys[i]);
      if (bad) return problem([...parts, keys[i]], bad);
      stack.push([(v as Record<string, unknown>)[keys[i]], [...parts, keys[i]]]);
    }
  }
  return null;
}
