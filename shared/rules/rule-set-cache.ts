import type { RuleSet } from './rule-set-schema';

interface Entry<T> {
  source: RuleSet;
  text: string;
  value: T;
}

/**
 * Keeps what is built from a rule set (compiled conditions, json-rules-engine engines) by
 * code + version. Drafts keep their code and version while they are edited, so a hit also needs
 * the same object or, failing that, the same JSON text; callers treat rule-set objects as immutable.
 */
export class RuleSetCache<T> {
  readonly #entries = new Map<string, Entry<T>>();

  constructor(
    private readonly build: (ruleSet: RuleSet) => T,
    private readonly limit = 32,
  ) {}

  get(ruleSet: RuleSet): T {
    const key = `${ruleSet.code}@${ruleSet.version}`;
    const hit = this.#entries.get(key);
    if (hit && hit.source === ruleSet) return hit.value;
    const text = JSON.stringify(ruleSet);
    if (hit && hit.text === text) {
      hit.source = ruleSet;
      return hit.value;
    }
    const value = this.build(ruleSet);
    this.#entries.delete(key);
    this.#entries.set(key, { source: ruleSet, text, value });
    // Map keeps insertion order: the first key is the least recently built.
    if (this.#entries.size > this.limit) this.#entries.delete(this.#entries.keys().next().value as string);
    return value;
  }
}
