import { createTwoFilesPatch } from 'diff';
import canonicalize from 'canonicalize';

/**
 * A stable, line-oriented text of any JSON value: keys in RFC 8785 order, pretty-printed, so
 * that a diff shows only real changes and the same content always gives the same lines.
 */
export function canonicalText(value: unknown): string {
  return `${JSON.stringify(JSON.parse(canonicalize(value ?? null) ?? 'null'), null, 2)}\n`;
}

/** Unified diff of two JSON values; null when nothing changed. */
export function jsonDiff(before: unknown, after: unknown, oldName = 'before', newName = 'after'): string | null {
  const a = canonicalText(before);
  const b = canonicalText(after);
  if (a === b) return null;
  return createTwoFilesPatch(oldName, newName, a, b, undefined, undefined, { context: 3 });
}
