import { QueryTypes, type Sequelize } from 'sequelize';
import type { SignalRow } from '../../shared/schemas/review-health.schema';
import { ENGINE_VERSION } from '../../shared/engine';
import { storedOutcome } from '../rule-sets/impact-compare';
import { auditLink, coverFrom, type HealthScope } from './health-scope';
import { decodeAfter, keysetPage, type Listed, type PageAsk } from './signal-page';
import type { VersionFacts } from './standard-versions';
import { evaluateMissing, rememberedVerdict, type Candidate } from './verdict-memory';

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
  const missing = candidates.filter((c) => rememberedVerdict(keyOf(c)) === undefined);
  await evaluateMissing(sequelize, missing, versions, keyOf);
  const flipped = candidates.filter((c) => rememberedVerdict(keyOf(c)) !== (c.verdict ?? 'none'));
  const rest = flipped.filter(afterIn(ask));
  const page = keysetPage(rest, ask, (c) => [new Date(Number(c.approvedMs)).toISOString(), c.id]);
  if (page.rows.length === 0) return { rows: [], total: 0, next: null };
  const details = await detailsOf(
    sequelize,
    page.rows.map((c) => c.id),
  );
  const rows = page.rows.map((c) => flipRow(details.get(c.id)!, c, versions, rememberedVerdict(keyOf(c))));
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

/** What the signal's rows show of each revision on the page: calc, project, label, when approved, stored outcome. */
async function detailsOf(sequelize: Sequelize, ids: number[]): Promise<Map<number, Detail>> {
  const details = await sequelize.query<Detail>(
    `SELECT r.id, r.calc_id AS calcId, r.label, r.approved_at AS approvedAt, c.number, p.code, r.outcome
     FROM revisions r JOIN calcs c ON c.id = r.calc_id JOIN projects p ON p.id = c.project_id WHERE r.id IN (?)`,
    { replacements: [ids], type: QueryTypes.SELECT },
  );
  return new Map(details.map((d) => [d.id, d]));
}

function flipRow(d: Detail, c: Candidate, versions: Map<number, VersionFacts>, verdictNow?: string): SignalRow {
  const v = versions.get(c.ruleSetId)!;
  const now = versions.get(v.currentId!)!;
  const approvedAs = storedOutcome(d.outcome, c.verdict).verdict;
  return {
    signal: 'verdict-flip' as const,
    projectCode: d.code,
    calcId: d.calcId,
    calcNumber: d.number,
    revision: d.label,
    fact:
      `Approved as ${approvedAs} under ${v.code} v${v.version}; ` +
      `${verdictNow} when re-evaluated under v${now.version}, in force today`,
    people: '',
    at: new Date(d.approvedAt).toISOString(),
    measure: null,
    evidence: [
      auditLink('Approval signature', { calcId: d.calcId, action: 'revision.signed_approved' }),
      auditLink('The standard’s version changes', { entityType: 'RuleSet', action: 'rule_set.effective' }),
    ],
  };
}
