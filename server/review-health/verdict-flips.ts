import { QueryTypes, type Sequelize } from 'sequelize';
import type { SignalRow } from '../../shared/schemas/review-health.schema';
import { ENGINE_VERSION } from '../../shared/engine';
import type { RuleSet } from '../../shared/rules';
import { loadRuleSet } from '../rule-sets/rule-set-cache';
import { outcomeUnder, storedOutcome } from '../rule-sets/impact-compare';
import { auditLink, coverFrom, type HealthScope } from './health-scope';
import { decodeAfter, keysetPage, type Listed, type PageAsk } from './signal-page';
import type { VersionFacts } from './standard-versions';

interface Candidate {
  id: number;
  ruleSetId: number;
  verdict: string | null;
  /** Milliseconds since 1970 (UTC): thousands of candidates are read per answer, and Dates cost parsing each. */
  approvedMs: number;
}
const NEWEST = [{ sql: 'approvedAt', isDate: true }, { sql: 'id' }];
interface Detail {
  id: number;
  calcId: number;
  label: string;
  approvedAt: Date;
  number: string;
  code: string;
  outcome: string | null;
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

/** Approved revisions whose verdict differs under the version of their standard in force today (impact analysis). */
export async function verdictFlips(
  sequelize: Sequelize,
  scope: HealthScope,
  versions: Map<number, VersionFacts>,
  ask: PageAsk,
): Promise<Listed> {
  const outdated = [...versions.values()].filter((v) => v.currentId !== null);
  if (outdated.length === 0) return { rows: [], total: 0, next: null };
  const { from, project } = coverFrom(scope, 'revisions_open_approvals');
  // Read from the covering index, approvals in force only, newest first: ids, versions and verdicts only.
  const candidates = await sequelize.query<Candidate>(
    `SELECT r.id, r.rule_set_id AS ruleSetId, r.verdict,
       TIMESTAMPDIFF(MICROSECOND, '1970-01-01', r.approved_at) DIV 1000 AS approvedMs ${from}
     WHERE r.status = 'approved' AND r.approved_at >= ? AND r.approved_at < ? AND r.rule_set_id IN (?)${project.sql}
     ORDER BY r.approved_at DESC, r.id DESC`,
    { replacements: [scope.start, scope.end, outdated.map((v) => v.id), ...project.values], type: QueryTypes.SELECT },
  );
  // The key's tail per version, worked out once: thousands of candidates are keyed per answer.
  const tails = new Map(outdated.map((v) => [v.id, `|${v.currentId}|${ENGINE_VERSION}`]));
  const keyOf = (c: Candidate) => `${c.id}${tails.get(c.ruleSetId)}`;
  await evaluateMissing(
    sequelize,
    candidates.filter((c) => !verdictCache.has(keyOf(c))),
    versions,
    keyOf,
  );
  const flipped = candidates.filter((c) => verdictCache.get(keyOf(c)) !== (c.verdict ?? 'none'));
  const rest = flipped.filter(afterIn(ask));
  const page = keysetPage(rest, ask, (c) => [new Date(Number(c.approvedMs)).toISOString(), c.id]);
  if (page.rows.length === 0) return { rows: [], total: 0, next: null };
  const details = new Map(
    (
      await sequelize.query<Detail>(
        `SELECT r.id, r.calc_id AS calcId, r.label, r.approved_at AS approvedAt, c.number, p.code, r.outcome
     FROM revisions r JOIN calcs c ON c.id = r.calc_id JOIN projects p ON p.id = c.project_id WHERE r.id IN (?)`,
        { replacements: [page.rows.map((c) => c.id)], type: QueryTypes.SELECT },
      )
    ).map((d) => [d.id, d]),
  );
  const rows = page.rows.map((c): SignalRow => {
    const d = details.get(c.id)!;
    const v = versions.get(c.ruleSetId)!;
    const now = versions.get(v.currentId!)!;
    return {
      signal: 'verdict-flip' as const,
      projectCode: d.code,
      calcId: d.calcId,
      calcNumber: d.number,
      revision: d.label,
      fact: `Approved as ${storedOutcome(d.outcome, c.verdict).verdict} under ${v.code} v${v.version}; ${verdictCache.get(keyOf(c))} when re-evaluated under v${now.version}, in force today`,
      people: '',
      at: new Date(d.approvedAt).toISOString(),
      measure: null,
      evidence: [
        auditLink('Approval signature', { calcId: d.calcId, action: 'revision.signed_approved' }),
        auditLink('The standard’s version changes', { entityType: 'RuleSet', action: 'rule_set.effective' }),
      ],
    };
  });
  return { rows, total: rest.length, next: page.next };
}

/** Candidates after the cursor, as the keyset condition would pick them in SQL (newest first). */
function afterIn(ask: PageAsk): (c: Candidate) => boolean {
  if (!ask.after) return () => true;
  const [at, id] = decodeAfter(ask.after, NEWEST);
  const time = Date.parse(String(at));
  return (c) => {
    const t = Number(c.approvedMs);
    return t < time || (t === time && c.id < Number(id));
  };
}

/**
 * Judges the revisions not yet judged. Many revisions share one stored input (copies, repeat designs), so the
 * database hashes the inputs and each distinct input is read, parsed and judged once per current version; the
 * verdict is remembered by content hash too, so a later revision with a known input costs no evaluation.
 */
async function evaluateMissing(
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
    if (unjudged.size > 0) {
      const ids = [...unjudged.values()];
      const inputs = await sequelize.query<{ id: number; input: string }>(
        'SELECT id, input FROM revisions WHERE id IN (?)',
        { replacements: [ids], type: QueryTypes.SELECT },
      );
      const inputOf = new Map(inputs.map((r) => [r.id, r.input]));
      for (const [key, id] of unjudged) {
        const currentId = Number(key.split('|')[1]);
        const verdict = outcomeUnder(JSON.parse(inputOf.get(id)!), await docOf(currentId)).verdict ?? 'none';
        remember(verdictByInput, key, verdict);
      }
    }
    for (const c of batch)
      remember(verdictCache, keyOf(c), verdictByInput.get(hashKey(hashOf.get(c.id)!, currentOf(c)))!);
  }
}
