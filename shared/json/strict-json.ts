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
