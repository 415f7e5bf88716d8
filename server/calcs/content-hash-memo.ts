import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';

/*
 * Reading a revision recomputes its content hash, so a changed row shows as a broken signature on every screen, and
 * validates its stored input, to name what is missing. The canonical JSON of a calc (RFC 8785 over tens of kilobytes)
 * costs milliseconds per read, the input schema about one; a SHA-256 over the stored texts themselves costs a tenth
 * of one. So both answers are remembered under a digest of every stored text and value they are computed from: any
 * change to them, through the app or behind its back, is a new key and is computed afresh, so tampering still shows on
 * the next read. Only pure functions of those texts are remembered.
 */
const hashes = new LRUCache<string, string>({ max: 5_000 });
const validations = new LRUCache<string, { value: unknown }>({ max: 5_000 });

/** A digest over everything an answer is built from, each part length-prefixed so no two lists share one. */
export function contentKeyOf(parts: readonly (string | number | null | undefined)[]): string {
  const hash = createHash('sha256');
  for (const p of parts) {
    const text = p == null ? '\u0000' : String(p);
    hash.update(`${text.length}:`).update(text);
  }
  return hash.digest('hex');
}

/** The content hash remembered for `key`, or `compute()`'s, remembered. */
export async function memoisedHash(key: string, compute: () => Promise<string>): Promise<string> {
  const known = hashes.get(key);
  if (known !== undefined) return known;
  const hash = await compute();
  hashes.set(key, hash);
  return hash;
}

/** What `validate` answers for this stored input text, remembered by the text's digest. */
export function memoisedValidation<T>(inputText: string, validate: (text: string) => T): T {
  const key = contentKeyOf([inputText]);
  const known = validations.get(key);
  if (known) return known.value as T;
  const value = validate(inputText);
  validations.set(key, { value });
  return value;
}

/** Remembers what `validate` would answer for this input text, known already (a save's engine run validated it). */
export function rememberValidation<T>(inputText: string, value: T): void {
  validations.set(contentKeyOf([inputText]), { value });
}
