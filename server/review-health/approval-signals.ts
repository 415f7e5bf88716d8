import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthSettings, SignalRow } from '../../shared/schemas/review-health.schema';
import type { SignedAttachment } from '../calcs/revision-content';
import { auditLink, plural, projectClause, ROW_CAP, type HealthScope } from './health-scope';
import type { VersionFacts } from './standard-versions';

const APPROVED = `r.approved_at >= ? AND r.approved_at < ? AND r.status IN ('approved', 'superseded')`;
const COLUMNS = `r.id, r.calc_id AS calcId, r.label, r.rule_set_id AS ruleSetId, r.approved_at AS approvedAt, c.number, p.code,
  u.display_name AS approver`;
const FROM = `FROM revisions r JOIN calcs c ON c.id = r.calc_id JOIN projects p ON p.id = c.project_id LEFT JOIN users u ON u.id = r.approver_id`;
const BASE = `SELECT ${COLUMNS} ${FROM}`;

interface Approved {
  id: number;
  calcId: number;
  label: string;
  ruleSetId: number;
  approvedAt: Date;
  number: string;
  code: string;
  approver: string | null;
}

const whereOf = (scope: HealthScope) => {
  const project = projectClause(scope);
  return { sql: `WHERE ${APPROVED}${project.sql}`, values: [scope.start, scope.end, ...project.values] };
};

const calcOf = (r: Approved) => ({ projectCode: r.code, calcId: r.calcId, calcNumber: r.number, revision: r.label });
const signaturesLink = (r: Approved) =>
  auditLink('Signatures on this calc', { calcId: r.calcId, action: 'revision.signed' });

/** Approved revisions whose attachment set at approval differs from the set the last check signature covered. */
export async function attachmentsAfterCheck(sequelize: Sequelize, scope: HealthScope): Promise<SignalRow[]> {
  const where = whereOf(scope);
  // The latest signature of each meaning (ids grow with time), found on the (revision_id, meaning) index.
  const last = (meaning: string) =>
    `(SELECT s.attachments FROM signatures s WHERE s.id = (SELECT MAX(x.id) FROM signatures x WHERE x.revision_id = r.id AND x.meaning = '${meaning}'))`;
  const rows = await sequelize.query<Approved & { checkedSet: string; approvedSet: string }>(
    `SELECT * FROM (SELECT ${COLUMNS}, ${last('checked')} AS checkedSet, ${last('approved')} AS approvedSet ${FROM} ${where.sql}) t
     WHERE t.checkedSet IS NOT NULL AND t.approvedSet IS NOT NULL AND t.checkedSet <> t.approvedSet
     ORDER BY t.approvedAt DESC LIMIT ${ROW_CAP + 1}`,
    { replacements: where.values, type: QueryTypes.SELECT },
  );
  return rows.map((r) => {
    const { added, removed } = setChange(JSON.parse(r.checkedSet), JSON.parse(r.approvedSet));
    const parts = [
      added.length ? `added after the check: ${added.join(', ')}` : '',
      removed.length ? `removed after the check: ${removed.join(', ')}` : '',
    ];
    return {
      signal: 'attachments-after-check',
      ...calcOf(r),
      fact: `Approved with ${plural(added.length + removed.length, 'attachment')} changed since the check signature (${parts.filter(Boolean).join('; ')})`,
      people: r.approver ? `approver ${r.approver}` : '',
      at: new Date(r.approvedAt).toISOString(),
      measure: added.length + removed.length,
      evidence: [auditLink('Attachment changes', { calcId: r.calcId, action: 'attachment.' }), signaturesLink(r)],
    };
  });
}

function setChange(before: SignedAttachment[], after: SignedAttachment[]): { added: string[]; removed: string[] } {
  const key = (a: SignedAttachment) => `${a.sha256}|${a.name}|${a.kind}`;
  const had = new Set(before.map(key));
  const has = new Set(after.map(key));
  return {
    added: after.filter((a) => !had.has(key(a))).map((a) => a.name),
    removed: before.filter((a) => !has.has(key(a))).map((a) => a.name),
  };
}

/** Approvals under a version that was replaced within the set number of days after them (or had been before them). */
export async function replacedStandard(
  sequelize: Sequelize,
  scope: HealthScope,
  settings: HealthSettings,
  versions: Map<number, VersionFacts>,
): Promise<SignalRow[]> {
  const replaced = [...versions.values()].filter((v) => v.replacedBy);
  if (replaced.length === 0) return [];
  const where = whereOf(scope);
  // Per replaced version, only approvals from N days before its successor took effect on.
  const near = replaced.map(() => '(r.rule_set_id = ? AND r.approved_at >= ?)').join(' OR ');
  const bounds = replaced.flatMap((v) => [
    v.id,
    new Date(Date.parse(`${v.replacedBy!.on}T00:00:00Z`) - settings.replacedWithinDays * 86_400_000),
  ]);
  const rows = await sequelize.query<Approved>(
    `${BASE} ${where.sql} AND (${near}) ORDER BY r.approved_at DESC LIMIT ${ROW_CAP + 1}`,
    { replacements: [...where.values, ...bounds], type: QueryTypes.SELECT },
  );
  const out: SignalRow[] = [];
  for (const r of rows) {
    const v = versions.get(r.ruleSetId)!;
    const days = (Date.parse(`${v.replacedBy!.on}T00:00:00Z`) - new Date(r.approvedAt).getTime()) / 86_400_000;
    if (days > settings.replacedWithinDays) continue;
    const when =
      Math.abs(days) < 1
        ? 'on the day'
        : days >= 0
          ? `${plural(Math.ceil(days), 'day')} before`
          : `${plural(Math.floor(-days), 'day')} after`;
    out.push({
      signal: 'replaced-standard',
      ...calcOf(r),
      fact: `Approved under ${v.code} v${v.version} ${when} v${v.replacedBy!.version} took effect (${v.replacedBy!.on})`,
      people: r.approver ? `approver ${r.approver}` : '',
      at: new Date(r.approvedAt).toISOString(),
      measure: Math.round(days * 10) / 10,
      evidence: [
        signaturesLink(r),
        auditLink('The standard’s version changes', { entityType: 'RuleSet', action: 'rule_set.effective' }),
      ],
    });
    if (out.length > ROW_CAP) break;
  }
  return out;
}
