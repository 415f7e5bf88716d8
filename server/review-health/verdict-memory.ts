import { QueryTypes, type Sequelize } from 'sequelize';
import { ENGINE_VERSION } from '../../shared/engine';
import type { RuleSet } from '../../shared/rules';
import { loadRuleSet } from '../rule-sets/rule-set-cache';
import { outcomeUnder } from '../rule-sets/impact-compare';
import type { VersionFacts } from './standard-versions';

/** An approved revision as the verdict-flip signal reads it first. */
export interface Candidate {
  id: number;
  ruleSetId: number;
  verdict: string | null;
  /** Milliseconds since 1970 (UTC): thousands of candidates are read per answer, and Dates cost parsing each. */
  approvedMs: number;
}

/**
 * An approved revision's input never changes, nor does a version in force, so its outcome under the
 * current version is remembered per (revision, version, engine): only revisions approved since the last
 * look are evaluated. The map is bounded; past its size the oldest entries go first.
 */
const CACHE_LIMIT = 200_000;
const verdictCache = new Map<string, string>();
/** The same verdicts by (input content hash, version, engine): one evaluation per distinct input. */
const verdictByInput = new Map<string, string>();

function remember(cache: Map<string, string>, key: string, value: string): void {
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  cache.set(key, value);
}

/** The verdict remembered under `key` (revision, current version, engine), if it has been judged. */
export function rememberedVerdict(key: string): string | undefined {
  return verdictCache.get(key);
}

/**
 * Judges the revisions not yet judged. Many revisions share one stored input (copies, repeat designs), so the
 * database hashes the inputs and each distinct input is read, parsed and judged once per current version; the
 * verdict is remembered by content hash too, so a later revision with a known input costs no evaluation.
 */
export async function evaluateMissing(
  sequelize: Sequelize,
  missing: Candidate[],
  versions: Map<number, VersionFacts>,
  keyOf: (c: Candidate) => string,
): Promise<void> {
  const docs = new Map<number, RuleSet>();
  const docOf = async (id: number) => docs.get(id) ?? docs.set(id, (await loadRuleSet(id)).doc).get(id)!;
  const hashKey = (hash: string, currentId: number) => `${hash}|${currentId}|${ENGINE_VERSION}`;
  for (let i = 0; i < missing.length; i += 2000) {
    const batch = missing.slice(i, i + 2000);
    const hashes = await sequelize.query<{ id: number; hash: string }>(
      'SELECT id, SHA2(input, 256) AS hash FROM revisions WHERE id IN (?)',
      { replacements: [batch.map((c) => c.id)], type: QueryTypes.SELECT },
    );
    const hashOf = new Map(hashes.map((r) => [r.id, r.hash]));
    const currentOf = (c: Candidate) => versions.get(c.ruleSetId)!.currentId!;
    const unjudged = new Map<string, number>();
    for (const c of batch) {
      const key = hashKey(hashOf.get(c.id)!, currentOf(c));
      if (!verdictByInput.has(key) && !unjudged.has(key)) unjudged.set(key, c.id);
    }
    if (unjudged.size > 0) await judgeInputs(sequelize, unjudged, docOf);
    for (const c of batch)
      remember(verdictCache, keyOf(c), verdictByInput.get(hashKey(hashOf.get(c.id)!, currentOf(c)))!);
  }
}

/** Each distinct input (`unjudged`: key → a revision holding it) read, parsed and judged once. */
async function judgeInputs(
  sequelize: Sequelize,
  unjudged: Map<string, number>,
  docOf: (id: number) => Promise<RuleSet>,
): Promise<void> {
  const ids = [...unjudged.values()];
  const inputs = await sequelize.query<{ id: number; input: string }>(
    'SELECT id, input FROM revisions WHERE id IN (?)',
    {
      replacements: [ids],
      type: QueryTypes.SELECT,
    },
  );
  const inputOf = new Map(inputs.map((r) => [r.id, r.input]));
  for (const [key, id] of unjudged) {
    const currentId = Number(key.split('|')[1]);
    const verdict = outcomeUnder(JSON.parse(inputOf.get(id)!), await docOf(currentId)).verdict ?? 'none';
    remember(verdictByInput, key, verdict);
  }
}
