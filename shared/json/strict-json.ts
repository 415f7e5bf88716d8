import { parse, type AnyNode } from '@humanwhocodes/momoa';
import {
  JSON_LIMITS,
  jsonValueProblem,
  pathText,
  type JsonIssue,
  type JsonLimits,
  type Part,
} from './json-value-check';

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

/*
 * The syntax tree is built only when the text may hold what JSON.parse hid (a repeated key, an underflow): it costs
 * ten times the parse. A repeated key leaves the parsed value with fewer keys than the text writes. In text that
 * JSON.parse accepted, a quote outside a string is always the start of one, so reading string after string from the
 * start finds every string; one followed by a colon is a key. An underflow needs a negative exponent or hundreds of
 * digits (the smallest double is about 4.9e-324); a text with either anywhere, even inside a string, takes the tree.
 */
const STRING_TOKEN = /"[^"\\]*(?:\\.[^"\\]*)*"([ \t\n\r]*:)?/g;
const MAY_UNDERFLOW = /[eE]-|[0-9]{300}/;

function keysWritten(text: string): number {
  let keys = 0;
  for (const m of text.matchAll(STRING_TOKEN)) if (m[1] !== undefined) keys++;
  return keys;
}

// Iterative: jsonValueProblem has capped the depth and the count of values, not the recursion of a reader.
function keyCountOf(value: object): number {
  let keys = 0;
  const stack: unknown[] = [value];
  while (stack.length > 0) {
    const v = stack.pop();
    if (v === null || typeof v !== 'object') continue;
    const children = Array.isArray(v) ? v : Object.values(v);
    if (!Array.isArray(v)) keys += children.length;
    for (const c of children) if (c !== null && typeof c === 'object') stack.push(c);
  }
  return keys;
}

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
  if (keyCountOf(value) === keysWritten(body) && !MAY_UNDERFLOW.test(body)) return { ok: true, value };
  const found = findInTree(parse(body, { mode: 'json' }).body, [], body);
  return found ? { ok: false, issue: found } : { ok: true, value };
}
