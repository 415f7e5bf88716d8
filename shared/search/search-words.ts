/**
 * The search box's words: split on anything but letters and digits, lower-cased, cut to the
 * letters the term index keeps (migrations/20261231-0401-calc-search-terms.ts), each kept once.
 * A word that starts another typed word adds nothing ("sha shaft" asks only for "shaft").
 * Shared so that the query schema can refuse what the server could not search for.
 */
export const SEARCH_TERM_LENGTH = 12;
export const SEARCH_MAX_WORDS = 8;

export function searchWords(q: string): string[] {
  const words = [
    ...new Set(
      q
        .toLowerCase()
        .split(/[^\p{L}\p{N}]+/u)
        .filter(Boolean)
        .map((w) => Array.from(w).slice(0, SEARCH_TERM_LENGTH).join('')),
    ),
  ];
  return words.filter((w) => !words.some((other) => other !== w && other.startsWith(w)));
}
