/*
 * JSON as Torquetrail accepts it from outside (request bodies, evidence packs, stored documents).
 * JSON.parse alone lets through what later code cannot hold: 1e309 becomes Infinity (and then a
 * silent null in storage), 1e-400 becomes 0, "__proto__" keys break objects built from user keys,
 * a lone UTF-16 surrogate is stored as "?", a duplicate key silently drops a value, and 5,000
 * levels of nesting overflow the stack of the first recursive reader. Each of these is refused here with the path of
 * the field, in the form zod uses (`segments[0].od`), so the client can point at it.
 */

export interface JsonLimits {
  /** Levels of objects and arrays; Torquetrail's own documents need fewer than 10. */
  maxDepth: number;
  /** Values in the whole document (objects, arrays, strings, numbers, ...). */
  maxNodes: number;
}

export const JSON_LIMITS: Readonly<JsonLimits> = { maxDepth: 32, maxNodes: 200_000 };

export interface JsonProblem {
  path: string;
  message: string;
}

export type StrictJsonResult = { ok: true; value: unknown } | { ok: false; problem: JsonProblem };

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
  if (typeof value === 'number' && !Number.isFinite(value)) return 'is a number beyond the range that can be stored (±1.8e308)';
  if (typeof value === 'string' && hasLoneSurrogate(value)) return 'contains invalid text (a lone surrogate); nothing was changed';
  return null;
}

type Part = string | number;
const pathText = (parts: readonly Part[], root: string): string =>
  parts.reduce<string>((acc, k) => (typeof k === 'number' ? indexPath(acc, k) : keyPath(acc, k)), root);

/**
 * Checks an already-parsed value (a request body, a stored document) against the limits above.
 * Iterative, so a document nested beyond any limit cannot overflow the stack while being checked.
 * `parts` is the same path as `path`, as zod wants it for an issue.
 */
export function jsonValueProblem(value: unknown, limits: JsonLimits = JSON_LIMITS, root = ''): (JsonProblem & { parts: Part[] }) | null {
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

interface Frame { keys: Set<string> | null; path: string; index: number; key: string; expectKey: boolean }

const childPath = (top: Frame | undefined): string =>
  !top ? '' : top.keys ? keyPath(top.path, top.key) : indexPath(top.path, top.index);

// A number token that reads as 0 though its digits are not all zero (1e-400) underflowed.
const UNDERFLOW = /^-?[0-9.]*[1-9]/;

/**
 * The first problem only the text shows, in `text`, which must already be valid JSON: a key that
 * appears twice in one object (JSON.parse keeps the last value and drops the first without a
 * word), or a non-zero number too small to be held (JSON.parse reads 1e-400 as 0).
 */
export function textProblem(text: string): JsonProblem | null {
  const stack: Frame[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    const top = stack[stack.length - 1];
    if (c === '"') {
      let j = i + 1;
      while (text[j] !== '"') j += text[j] === '\\' ? 2 : 1;
      if (top?.keys && top.expectKey) {
        const raw = text.slice(i, j + 1);
        const key = raw.includes('\\') ? (JSON.parse(raw) as string) : raw.slice(1, -1);
        if (top.keys.has(key)) return { path: keyPath(top.path, key), message: 'appears twice in the same object' };
        top.keys.add(key);
        top.key = key;
        top.expectKey = false;
      }
      i = j;
    } else if (c === '-' || (c >= '0' && c <= '9')) {
      let j = i + 1;
      while (j < text.length && /[0-9eE.+-]/.test(text[j])) j++;
      const token = text.slice(i, j);
      if (Number(token) === 0 && UNDERFLOW.test(token)) return { path: childPath(top), message: 'is a non-zero number too small to be stored (it would read as 0)' };
      i = j - 1;
    } else if (c === '{' || c === '[') {
      stack.push({ keys: c === '{' ? new Set() : null, path: childPath(top), index: 0, key: '', expectKey: c === '{' });
    } else if (c === '}' || c === ']') {
      stack.pop();
    } else if (c === ',' && top) {
      if (top.keys) top.expectKey = true;
      else top.index++;
    }
  }
  return null;
}

/** The path of the first key that appears twice in one object of `text` (valid JSON), or null. */
export function duplicateKeyPath(text: string): string | null {
  const problem = textProblem(text);
  return problem && problem.message.startsWith('appears twice') ? problem.path : null;
}

/** Parses JSON text and applies every check above; a syntax error is a problem at the root. */
export function parseStrictJson(text: string, limits: JsonLimits = JSON_LIMITS): StrictJsonResult {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return { ok: false, problem: { path: '', message: 'is not valid JSON' } };
  }
  const problem = jsonValueProblem(value, limits) ?? textProblem(text);
  return problem ? { ok: false, problem } : { ok: true, value };
}
