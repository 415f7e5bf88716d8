import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthSettings, SignalRow } from '../../shared/schemas/review-health.schema';
import { auditLink, coverFrom, plural, type HealthScope, type RevisionCover } from './health-scope';
import { afterCursor, keysetPage, limitOf, totalOf, type Listed, type PageAsk } from './signal-page';
import { setChange } from './review-facts';
import type { VersionFacts } from './standard-versions';

const APPROVED = `r.approved_at >= ? AND r.approved_at < ? AND r.status IN ('approved', 'superseded')`;

interface Approved {
  id: number;
  calcId: number;
  label: string;
  ruleSetId: number;
  approvedAt: Date;
  number: string;
  code: string;
  approver: string | null;
  total: number;
}

const NEWEST = [{ sql: 'r.approved_at', isDate: true }, { sql: 'r.id' }];

/**
 * A page of the period's approvals matching `filter` (on columns of the covering index), newest first, with their
 * count; only the page's rows are joined to their calc, project and approver. `extra` adds columns over them (alias r);
 * `index` is the covering index that holds the filter's entries (the period's approvals unless told otherwise).
 */
async function approvals<T>(
  sequelize: Sequelize,
  scope: HealthScope,
  filter: { sql: string; values: unknown[]; index?: RevisionCover },
  ask: PageAsk,
  extra = '',
): Promise<{ rows: (Approved & T)[]; total: number; next: string | null }> {
  const { from, project } = coverFrom(scope, filter.index ?? 'revisions_approved_cover');
  const after = afterCursor(ask, NEWEST, 'desc');
  const found = await sequelize.query<Approved & T>(
    `SELECT q.id, q.calcId, r.label, q.ruleSetId, q.approvedAt, c.number, p.code, u.display_name AS approver, q.total${extra}
     FROM (SELECT r.id, r.calc_id AS calcId, r.rule_set_id AS ruleSetId, r.approved_at AS approvedAt, r.approver_id AS approverId,
             COUNT(*) OVER () AS total
           ${from} WHERE ${APPROVED}${project.sql} AND (${filter.sql}) AND ${after.sql}
           ORDER BY r.approved_at DESC, r.id DESC ${limitOf(ask)}) q
       JOIN revisions r ON r.id = q.id JOIN calcs c ON c.id = q.calcId JOIN projects p ON p.id = c.project_id
       LEFT JOIN users u ON u.id = q.approverId
     ORDER BY q.approvedAt DESC, q.id DESC`,
    {
      replacements: [scope.start, scope.end, ...project.values, ...filter.values, ...after.replacements],
      type: QueryTypes.SELECT,
    },
  );
  const page = keysetPage(found, ask, (r) => [new Date(r.approvedAt).toISOString(), r.id]);
  return { ...page, total: totalOf(found) };
}

const calcOf = (r: Approved) => ({ projectCode: r.code, calcId: r.calcId, calcNumber: r.number, revision: r.label });
const signaturesLink = (r: Approved) =>
  auditLink('Signatures on this calc', { calcId: r.calcId, action: 'revision.signed' });

/**
 * Approved revisions whose attachment set at approval differs from the set the last check signature covered:
 * found by the count the approval signature recorded (review-facts.ts; the index leads with it, so only those
 * approvals are read), named from the two signatures themselves.
 */
export async function attachmentsAfterCheck(sequelize: Sequelize, scope: HealthScope, ask: PageAsk): Promise<Listed> {
  const last = (meaning: string) =>
    `(SELECT s.attachments FROM signatures s WHERE s.revision_id = q.id AND s.meaning = '${meaning}' ORDER BY s.id DESC LIMIT 1)`;
  const page = await approvals<{ checkedSet: string; approvedSet: string }>(
    sequelize,
    scope,
    { sql: 'r.attachments_changed > 0', values: [], index: 'revisions_attachments_changed' },
    ask,
    `, ${last('checked')} AS checkedSet, ${last('approved')} AS approvedSet`,
  );
  const rows = page.rows.map((r): SignalRow => {
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
  return { ...page, rows };
}

/** Approvals under a version that was replaced within the set number of days after them (or had been before them). */
export async function replacedStandard(
  sequelize: Sequelize,
  scope: HealthScope,
  settings: HealthSettings,
  versions: Map<number, VersionFacts>,
  ask: PageAsk,
): Promise<Listed> {
  const replaced = [...versions.values()].filter((v) => v.replacedBy);
  if (replaced.length === 0) return { rows: [], total: 0, next: null };
  // Per replaced version, only approvals from N days before its successor took effect on.
  const near = replaced.map(() => '(r.rule_set_id = ? AND r.approved_at >= ?)').join(' OR ');
  const bounds = replaced.flatMap((v) => [
    v.id,
    new Date(Date.parse(`${v.replacedBy!.on}T00:00:00Z`) - settings.replacedWithinDays * 86_400_000),
  ]);
  const page = await approvals(sequelize, scope, { sql: near, values: bounds }, ask);
  const rows = page.rows.map((r): SignalRow => {
    const v = versions.get(r.ruleSetId)!;
    const days = (Date.parse(`${v.replacedBy!.on}T00:00:00Z`) - new Date(r.approvedAt).getTime()) / 86_400_000;
    const when =
      Math.abs(days) < 1
        ? 'on the day'
        : days >= 0
          ? `${plural(Math.ceil(days), 'day')} before`
          : `${plural(Math.floor(-days), 'day')} after`;
    return {
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
    };
  });
  return { ...page, rows };
}
