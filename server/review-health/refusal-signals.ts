import { QueryTypes, type Sequelize } from 'sequelize';
import type { HealthSettings, SignalRow } from '../../shared/schemas/review-health.schema';
import { auditLink, plural, projectClause, type HealthScope } from './health-scope';
import { afterCursor, keysetPage, limitOf, totalOf, type Listed, type PageAsk } from './signal-page';

interface Refusal {
  actorId: number | null;
  actorName: string;
  entityId: string;
  calcId: number | null;
  number: string | null;
  code: string | null;
  label: string | null;
  attempts: number;
  wrongPassword: number;
  codeMissing: number;
  codeWrong: number;
  codeNotSetUp: number;
  first: Date;
  last: Date;
  actorKey: number;
  total: number;
}

/** Most attempts first, then the latest; the person and revision make each group's place unique. */
const GROUP_ORDER = [{ sql: 'attempts' }, { sql: 'last', isDate: true }, { sql: 'actorKey' }, { sql: 'entityId' }];

/** Each refusal reason the signing path records (workflow.service.ts, second-factor.ts), as counted here. */
const REASONS = [
  ['wrongPassword', 'wrong password'],
  ['codeMissing', 'one-time code missing'],
  ['codeWrong', 'one-time code wrong'],
  ['codeNotSetUp', 'one-time code not set up'],
] as const;
const EARLIER_CODE_REASON = 'one-time code missing or wrong';

/**
 * Signing attempts refused for a wrong password, or a one-time code missing, wrong or not set up. The signing path
 * records each refusal as an audit entry (`revision.signature_refused`, workflow.service.ts) before it answers,
 * so the trail is the record; grouped here per person and revision from the per-day sums a trigger keeps beside
 * the trail (`signing_refusal_days`, migration 20261231-08): the same counts and times, without reading each entry.
 */
export async function refusedSignatures(
  sequelize: Sequelize,
  scope: HealthScope,
  settings: HealthSettings,
  ask: PageAsk,
): Promise<Listed> {
  const project = projectClause(scope, 'd.project_id');
  const after = afterCursor(ask, GROUP_ORDER, 'desc');
  const found = await sequelize.query<Refusal>(
    `SELECT g.*, c.number, p.code, r.label
     FROM (SELECT d.actor_id AS actorId, MAX(d.actor_name) AS actorName, d.entity_id AS entityId,
             MAX(d.calc_id) AS calcId, SUM(d.attempts) AS attempts,
             ${REASONS.map(([key, reason]) => `SUM(IF(d.reason = '${reason}', d.attempts, 0)) AS ${key}`).join(', ')},
             MIN(d.first_at) AS first, MAX(d.last_at) AS last, COALESCE(d.actor_id, 0) AS actorKey,
             COUNT(*) OVER () AS total
           FROM signing_refusal_days d
           WHERE d.day >= ? AND d.day < ?${project.sql}
           GROUP BY d.actor_id, d.entity_id HAVING ${after.sql}
           ORDER BY attempts DESC, last DESC, actorKey DESC, entityId DESC ${limitOf(ask)}) g
       LEFT JOIN calcs c ON c.id = g.calcId LEFT JOIN projects p ON p.id = c.project_id
       LEFT JOIN revisions r ON r.id = CAST(g.entityId AS UNSIGNED)
     ORDER BY g.attempts DESC, g.last DESC, g.actorKey DESC, g.entityId DESC`,
    {
      replacements: [scope.start, scope.end, ...project.values, ...after.replacements],
      type: QueryTypes.SELECT,
    },
  );
  const page = keysetPage(found, ask, (r) => [Number(r.attempts), iso8601(r.last), Number(r.actorKey), r.entityId]);
  const rows = page.rows.map((r): SignalRow => {
    const attempts = Number(r.attempts);
    const counted = REASONS.map(([key, reason]) => [reason, Number(r[key])] as const);
    // Entries written before a missing and a wrong code were told apart carry one reason for both.
    const earlier = attempts - counted.reduce((n, [, c]) => n + c, 0);
    const reasons = [...counted, [EARLIER_CODE_REASON, earlier] as const]
      .filter(([, n]) => n > 0)
      .map(([reason, n]) => `${reason} ×${n}`)
      .join(', ');
    const repeated = attempts >= settings.refusalRepeatCount ? 'Repeated: ' : '';
    const span =
      attempts > 1 && iso(r.first) !== iso(r.last)
        ? ` between ${iso(r.first)} and ${iso(r.last)}`
        : ` at ${iso(r.last)}`;
    return {
      signal: 'refusals',
      fact: `${repeated}${plural(attempts, 'signing attempt')} refused (${reasons})${span}; nothing was signed by these attempts`,
      projectCode: r.code,
      calcId: r.calcId,
      calcNumber: r.number,
      revision: r.label,
      people: r.actorName,
      at: new Date(r.last).toISOString(),
      measure: attempts,
      evidence: [
        auditLink('Refused attempts', { calcId: r.calcId, userId: r.actorId, action: 'revision.signature_refused' }),
        auditLink('Signatures on this calc', { calcId: r.calcId, action: 'revision.signed' }),
      ],
    };
  });
  return { ...page, rows, total: totalOf(found) };
}

const iso8601 = (d: Date) => new Date(d).toISOString();
const iso = (d: Date) => `${new Date(d).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
