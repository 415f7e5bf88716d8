import { parse, type AnyNode } from '@humanwhocodes/momoa';

/*
 * JSON.parse keeps the last of two equal keys without a word, so `"units": "SI"` followed by
 * `"units": "US"` would evaluate SI numbers as US ones. This parser refuses duplicate keys (with the
 * path and both line numbers) and accepts the UTF-8 byte-order mark that many editors write.
 * Plain TypeScript plus @humanwhocodes/momoa (a JSON syntax tree with positions): runs in the
 * server, the browser and the command line.
 */
export interface JsonIssue {
  path: string;
  message: string;
}

export type StrictJsonResult = { ok: true; value: unknown } | { ok: false; issue: JsonIssue };

const BOM = '\uFEFF';

// Characters a terminal or a form shows as nothing; a message names them instead (U+FEFF …).
const INVISIBLE = /[\u0000-\u001f\u007f-\u00a0\u00ad\u200b-\u200f\u2028-\u202f\u2060\ufeff]/g;

function visible(text: string): string {
  return text.replace(INVISIBLE, (c) => `U+${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`);
}

function pathText(path: readonly (string | number)[]): string {
  let out = '';
  for (const key of path) out += typeof key === 'number' ? `[${key}]` : out ? `.${key}` : key;
  return out || '(input)';
}

type Found = JsonIssue | null;

// Depth-first, so the first duplicate in reading order is the one reported.
function findDuplicate(node: AnyNode, path: (string | number)[]): Found {
  if (node.type === 'Array') {
    for (let i = 0; i < node.elements.length; i++) {
      const found = findDuplicate(node.elements[i].value, [...path, i]);
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
      return { path: pathText([...path, key]), message: `the key "${visible(key)}" appears twice in one object (${first} and ${where}); `
        + 'JSON readers would silently keep only the last one, so give each key once' };
    }
    seen.set(key, where);
    const found = findDuplicate(member.value, [...path, key]);
    if (found) return found;
  }
  return null;
}

/**
 * Parses JSON text like JSON.parse, but refuses duplicate keys and accepts a leading UTF-8 BOM.
 * Never throws: a problem comes back as `{ path, message }` with invisible characters named.
 */
export function parseStrictJson(text: string): StrictJsonResult {
  const body = text.startsWith(BOM) ? text.slice(BOM.length) : text;
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch (e) {
    return { ok: false, issue: { path: '(input)', message: `not valid JSON: ${visible((e as Error).message)}` } };
  }
  if (value === null || typeof value !== 'object') return { ok: true, value };
  try {
    const duplicate = findDuplicate(parse(body, { mode: 'json' }).body, []);
    return duplicate ? { ok: false, issue: duplicate } : { ok: true, value };
  } catch (e) {
    // JSON.parse accepted the text, so only a nesting too deep for the checker gets here.
    return { ok: false, issue: { path: '(input)', message: `could not be checked for duplicate keys: ${visible((e as Error).message)}` } };
  }
}
