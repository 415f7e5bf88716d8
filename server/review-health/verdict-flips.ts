import { QueryTypes, type Sequelize } from 'sequelize';
import type { SignalRow } from '../../shared/schemas/review-health.schema';
import { ENGINE_VERSION } from '../../shared/engine';
import type { RuleSet } from '../../shared/rules';
import { loadRuleSet } from '../rule-sets/rule-set-cache';
import { outcomeUnder, storedOutcome } from '../rule-sets/impact-compare';
import { auditLink, projectClause, ROW_CAP, type HealthScope } from './health-scope';
import type { VersionFacts } from './standard-versions';

interface Candidate { id: number; calcId: number; label: string; ruleSetId: number; approvedAt: Date; number: string; code: string; outcome: string | null; verdict: string | null }

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
export async function verdictFlips(sequelize: Sequelize, scope: HealthScope, versions: Map<number, VersionFacts>): Promise<SignalRow[]> {
  const outdated = [...versions.values()].filter((v) => v.currentId !== null);
  if (outdated.length === 0) return [];
  const project = projectClause(scope);
  const candidates = await sequelize.query<Candidate>(
    `SELECT r.id, r.calc_id AS calcId, r.label, r.rule_set_id AS ruleSetId, r.approved_at AS approvedAt, c.number, p.code, r.outcome, r.verdict
     FROM revisions r JOIN calcs c ON c.id = r.calc_id JOIN projects p ON p.id = c.project_id
     WHERE r.approved_at >= ? AND r.approved_at < ? AND r.status = 'approved' AND r.rule_set_id IN (?)${project.sql}
     ORDER BY r.approved_at DESC, r.id DESC`,
    { replacements: [scope.start, scope.end, outdated.map((v) => v.id), ...project.values], type: QueryTypes.SELECT },
  );
  const keyOf = (c: Candidate) => `${c.id}|${versions.get(c.ruleSetId)!.currentId}|${ENGINE_VERSION}`;
  await evaluateMissing(sequelize, candidates.filter((c) => !verdictCache.has(keyOf(c))), versions, keyOf);
  const out: SignalRow[] = [];
  for (const c of candidates) {
    const before = storedOutcome(c.outcome, c.verdict).verdict;
    const after = verdictCache.get(keyOf(c))!;
    if (before === after) continue;
    const v = versions.get(c.ruleSetId)!;
    const now = versions.get(v.currentId!)!;
    out.push({
      signal: 'verdict-flip', projectCode: c.code, calcId: c.calcId, calcNumber: c.number, revision: c.label,
      fact: `Approved as ${before} under ${v.code} v${v.version}; ${after} when re-evaluated under v${now.version}, in force today`,
      people: '', at: new Date(c.approvedAt).toISOString(), measure: null,
      evidence: [auditLink('Approval signature', { calcId: c.calcId, action: 'revision.signed_approved' }),
        auditLink('The standard’s version changes', { entityType: 'RuleSet', action: 'rule_set.effective' })],
    });
    if (out.length > ROW_CAP) break;
  }
  return out;
}

/** Reads the inputs (large texts) only of revisions not yet judged, in batches, and judges them. */
async function evaluateMissing(sequelize: Sequelize, missing: Candidate[], versions: Map<number, VersionFacts>, keyOf: (c: Candidate) => string): Promise<void> {
  const docs = new Map<number, RuleSet>();
  for (let i = 0; i < missing.length; i += 500) {
    const batch = missing.slice(i, i + 500);
    const inputs = await sequelize.query<{ id: number; input: string }>('SELECT id, input FROM revisions WHERE id IN (?)', { replacements: [batch.map((c) => c.id)], type: QueryTypes.SELECT });
    const byId = new Map(inputs.map((r) => [r.id, r.input]));
    for (const c of batch) {
      const currentId = versions.get(c.ruleSetId)!.currentId!;
      if (!docs.has(currentId)) docs.set(currentId, (await loadRuleSet(currentId)).doc);
      remember(keyOf(c), outcomeUnder(JSON.parse(byId.get(c.id)!), docs.get(currentId)!).verdict ?? 'none');
    }
  }
}
