import { parse, type AnyNode } from '@humanwhocodes/momoa';

/*
 * JSON as Torquetrail accepts it from outside: request bodies, evidence packs, calc files on the
 * command line, stored documents. JSON.parse alone lets through what later code cannot hold:
 * 1e309 becomes Infinity (and then a silent null in storage), 1e-400 becomes 0, "__proto__" keys
 * break objects built from user keys, a lone UTF-16 surrogate is stored as "?", the last of two
 * equal keys wins without a word (`"units": "SI"` then `"units": "US"`), and 5,000 levels of
 * nesting overflow the stack of the first recursive reader. Each is refused here with the path of
 * the field, in the form zod uses (`segments[0].od`); the UTF-8 byte-order mark many editors write
 * is accepted. Plain TypeScript plus @humanwhocodes/momoa (a JSON syntax tree with positions):
 * runs in the server, the browser and the command line.
 */
export interface JsonIssue {
  path: string;
  message: string;
}

export type StrictJsonResult = { ok: true; value: unknown } | { ok: false; issue: JsonIssue };

/** Path text for the root of a document in issues. */
export const ROOT_PATH = '(input)';

const BOM = '\uFEFF';

// Characters a terminal or a form shows as nothing; a message names them instead (U+FEFF …).
// eslint-disable-next-line no-control-regex -- control characters are among those it names
const INVISIBLE = /[\u0000-\u001f\u007f-\u00a0\u00ad\u200b-\u200f\u2028-\u202f\u2060\ufeff]/g;

function visible(text: string): string {
  return text.replace(INVISIBLE, (c) => `U+${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`);
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

type Part = string | number;
const pathText = (parts: readonly Part[], root: string): string =>
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

// A number that reads as 0 though a digit before its exponent is not zero (1e-400) underflowed.
const UNDERFLOW = /^-?[0-9.]*[1-9]/;

// Depth-first over the syntax tree, so the first problem in reading order is the one reported.
// Only called once jsonValueProblem has capped the depth, so the recursion is bounded.
function findInTree(node: AnyNode, path: (string | number)[], text: string): JsonIssue | null {
  if (node.type === 'Number') {
    const raw = text.slice(node.loc.start.offset, node.loc.end.offset);
    return node.value === 0 && UNDERFLOW.test(raw)
      ? { path: pathOf(path), message: 'is a non-zero number too small to be stored (it would read as 0)' }
      : null;
  }
  if (node.type === 'Array') {
    for (let i = 0; i < node.elements.length; i++) {
      const found = findInTree(node.elements[i].value, [...path, i], text);
      if (found) return found;
    }
  }
  if (node.type !== 'Object') return null;
  const seen = new Map<string, string>();
  for (const member of node.members) {
    const key = member.name.type === 'String' ? member.name.value : member.name.name;
    const { line, column } = member.name.loc.start;
    const where = `line ${line}, column ${column}`;
    const first = seen.get(key);
    if (first !== undefined) {
      return {
        path: pathOf([...path, key]),
        message:
          `the key "${visible(key)}" appears twice in one object (${first} and ${where}); ` +
          'JSON readers would silently keep only the last one, so give each key once',
      };
    }
    seen.set(key, where);
    const found = findInTree(member.value, [...path, key], text);
    if (found) return found;
  }
  return null;
}

const pathOf = (parts: readonly Part[]): string => pathText(parts, '') || ROOT_PATH;

/**
 * Parses JSON text like JSON.parse, but refuses what JSON.parse would silently change or what later
 * code cannot hold (see above), within `limits`. Never throws: a problem comes back as
 * `{ path, message }`, the root named "(input)", invisible characters named.
 */
export function parseStrictJson(text: string, limits: JsonLimits = JSON_LIMITS): StrictJsonResult {
  const body = text.startsWith(BOM) ? text.slice(BOM.length) : text;
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch (e) {
    return { ok: false, issue: { path: ROOT_PATH, message: `not valid JSON: ${visible((e as Error).message)}` } };
  }
  const problem = jsonValueProblem(value, limits);
  if (problem) return { ok: false, issue: { path: problem.path || ROOT_PATH, message: problem.message } };
  if (value === null || typeof value !== 'object') return { ok: true, value };
  const found = findInTree(parse(body, { mode: 'json' }).body, [], body);
  return found ? { ok: false, issue: found } : { ok: true, value };
}
