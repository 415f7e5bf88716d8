import { QueryTypes, type Sequelize } from 'sequelize';
import type { SignalRow } from '../../shared/schemas/review-health.schema';
import { ENGINE_VERSION } from '../../shared/engine';
import type { RuleSet } from '../../shared/rules';
import { loadRuleSet } from '../rule-sets/rule-set-cache';
import { outcomeUnder, storedOutcome } from '../rule-sets/impact-compare';
import { auditLink, coverFrom, ROW_CAP, type HealthScope } from './health-scope';
import type { VersionFacts } from './standard-versions';

interface Candidate {
  id: number;
  ruleSetId: number;
  verdict: string | null;
}
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

function remember(key: string, value: string): void {
  if (verdictCache.size >= CACHE_LIMIT) verdictCache.delete(verdictCache.keys().next().value!);
  verdictCache.set(key, value);
}

/** Approved revisions whose verdict differs under the version of their standard in force today (impact analysis). */
export async function verdictFlips(
  sequelize: Sequelize,
  scope: HealthScope,
  versions: Map<number, VersionFacts>,
): Promise<SignalRow[]> {
  const outdated = [...versions.values()].filter((v) => v.currentId !== null);
  if (outdated.length === 0) return [];
  const { from, project } = coverFrom(scope, 'revisions_approved_cover');
  // Read from the covering index: ids, versions and verdicts only.
  const candidates = await sequelize.query<Candidate>(
    `SELECT r.id, r.rule_set_id AS ruleSetId, r.verdict ${from}
     WHERE r.approved_at >= ? AND r.approved_at < ? AND r.status = 'approved' AND r.rule_set_id IN (?)${project.sql}
     ORDER BY r.approved_at DESC, r.id DESC`,
    { replacements: [scope.start, scope.end, outdated.map((v) => v.id), ...project.values], type: QueryTypes.SELECT },
  );
  const keyOf = (c: Candidate) => `${c.id}|${versions.get(c.ruleSetId)!.currentId}|${ENGINE_VERSION}`;
  await evaluateMissing(
    sequelize,
    candidates.filter((c) => !verdictCache.has(keyOf(c))),
    versions,
    keyOf,
  );
  const flipped = candidates.filter((c) => verdictCache.get(keyOf(c)) !== (c.verdict ?? 'none')).slice(0, ROW_CAP + 1);
  if (flipped.length === 0) return [];
  const details = new Map(
    (
      await sequelize.query<Detail>(
        `SELECT r.id, r.calc_id AS calcId, r.label, r.approved_at AS approvedAt, c.number, p.code, r.outcome
     FROM revisions r JOIN calcs c ON c.id = r.calc_id JOIN projects p ON p.id = c.project_id WHERE r.id IN (?)`,
        { replacements: [flipped.map((c) => c.id)], type: QueryTypes.SELECT },
      )
    ).map((d) => [d.id, d]),
  );
  return flipped.map((c) => {
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
}

/** Reads the inputs (large texts) only of revisions not yet judged, in batches, and judges them. */
async function evaluateMissing(
  sequelize: Sequelize,
  missing: Candidate[],
  versions: Map<number, VersionFacts>,
  keyOf: (c: Candidate) => string,
): Promise<void> {
  const docs = new Map<number, RuleSet>();
  for (let i = 0; i < missing.length; i += 500) {
    const batch = missing.slice(i, i + 500);
    const inputs = await sequelize.query<{ id: number; input: string }>(
      'SELECT id, input FROM revisions WHERE id IN (?)',
      { replacements: [batch.map((c) => c.id)], type: QueryTypes.SELECT },
    );
    const byId = new Map(inputs.map((r) => [r.id, r.input]));
    for (const c of batch) {
      const currentId = versions.get(c.ruleSetId)!.currentId!;
      if (!docs.has(currentId)) docs.set(currentId, (await loadRuleSet(currentId)).doc);
      remember(keyOf(c), outcomeUnder(JSON.parse(byId.get(c.id)!), docs.get(currentId)!).verdict ?? 'none');
    }
  }
}
