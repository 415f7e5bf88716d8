import { plainSelect } from '../db/plain-query';
import type { AuditChainStatus, AuditEventDto, AuditQuery } from '../../shared/schemas/audit.schema';
import type { KeysetPage } from '../../shared/schemas/common.schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { AuditEvent, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { cappedCount, cappedCountSql, cappedTotal } from '../http/keyset';
import { verifyAuditChain } from './audit.service';
import { auditWhere } from './audit-filter';
import { likePrefix } from '../db/like-pattern';
import { recordLookup, recordOf, type RecordColumns } from './audit-records';
import { columnsOf, selectSql } from '../db/plain-rows';
import { forbiddenCheck } from '../authz/forbidden-check';

type Listed = AuditEvent & { hasDiff?: number };

export function toAuditDto(e: Listed): AuditEventDto {
  return {
    id: e.id,
    occurredAt: e.occurredAt.toISOString(),
    actorId: e.actorId,
    actorName: e.actorName,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    payload: JSON.parse(e.payload),
    diff: e.diff ?? null,
    hasDiff: e.diff != null || Boolean(e.hasDiff ?? e.get?.('hasDiff')),
    prevHash: e.prevHash,
    hash: e.hash,
  };
}

// Everything a list row shows; the diff (often kilobytes of canonical JSON) stays behind.
const LIST_ATTRIBUTES = [
  'id',
  'occurredAt',
  'actorId',
  'actorName',
  'action',
  'entityType',
  'entityId',
  'payload',
  'prevHash',
  'hash',
];
let listColumns: string | undefined;
const listColumnsOf = () =>
  (listColumns ??= columnsOf(
    AuditEvent,
    '`AuditEvent`',
    Object.keys(AuditEvent.getAttributes()).filter((name) => !LIST_ATTRIBUTES.includes(name)),
  ));
const FROM = 'FROM `audit_events` AS `AuditEvent`';
const RECORDS = recordLookup('`AuditEvent`');

/**
 * Newest first, paged by keyset (`after` the last id shown); counted up to a cap on the first page only. One statement
 * for a first page: its rows, what each is about (`recordLookup`) and the count; as three (the count on a second
 * connection) the app spent a fifth more CPU on the page (DEVELOPERS.md, "Measuring speed").
 */
export async function listAudit(
  ability: AppAbility,
  query: Omit<AuditQuery, 'page'> & { page?: number },
): Promise<KeysetPage<AuditEventDto>> {
  forbiddenCheck(ability).throwUnlessCan('read', 'AuditEvent');
  const sequelize = AuditEvent.sequelize!;
  const offset = query.after ? 0 : (query.page ?? 0) * query.size;
  // Sequelize writes the filter, order and bounds; the row is read with its record, so the columns are named here.
  const [, filter] = atFirst(
    selectSql(AuditEvent, {
      where: auditWhere(query),
      attributes: ['id'],
      order: [['id', 'DESC']],
      offset,
      limit: query.size + 1,
    }).replace(/;$/, ''),
    FROM,
  );
  const count = query.after ? null : countSql(query);
  // A page past the first by offset counts on its own: past the end it has no row to carry the count.
  const inline = count && offset === 0 ? count : null;
  const picked = await narrowPick(query, filter, offset);
  // Sent plain: through findAll, even with plain rows, the statement cost more CPU than the rest of the answer.
  const rows = await plainSelect<Listed & RecordColumns & { listedTotal?: number }>(
    sequelize,
    `SELECT ${listColumnsOf()}, \`AuditEvent\`.diff IS NOT NULL AS hasDiff, ${RECORDS.columns}
      ${inline ? `, ${cappedCountSql(inline.fromWhere)} AS listedTotal` : ''}
      ${picked ? picked.from : `${FROM} ${RECORDS.joins} ${filter}`}`,
    [...(inline?.params ?? []), ...(picked?.params ?? [])],
  );
  const counted = inline
    ? cappedTotal(Number(rows[0]?.listedTotal ?? 0))
    : count && (await cappedCount(sequelize, count.fromWhere, count.params));
  const items = rows.slice(0, query.size);
  return {
    items: items.map((r) => ({ ...toAuditDto(r), record: recordOf(r) })),
    size: query.size,
    total: counted ? counted.total : null,
    totalIsAtLeast: counted ? counted.totalIsAtLeast : false,
    next: rows.length > query.size ? String(items[items.length - 1].id) : null,
  };
}

/**
 * The page's ids picked from an index narrower than the rows, for an action group alone, within a project or of one
 * person (and nothing else but the keyset or page), else null: read as one walk of the rows newest first, each row
 * read to test its action, a project whose recent entries are mostly saves read thousands of rows for a page of
 * signatures, and the whole trail over a hundred thousand (100 ms alone on the bench library). The rows and what
 * they are about are then read for the page's ids alone.
 * - Within a project or of one person: their index holds the action (migration 20261231-17), so the walk
 *   reads index entries only.
 * - Alone: one range of the action index per action the group matches (each already in id order), merged; the
 *   actions are read from the table first (a loose index scan), so one never written by this version is listed too.
 */
async function narrowPick(
  query: Omit<AuditQuery, 'page'>,
  filter: string,
  offset: number,
): Promise<{ from: string; params: unknown[] } | null> {
  if (!query.action || query.calcId || query.entityType || query.from || query.to) return null;
  if (query.projectId && query.userId) return null;
  const walk = query.projectId ? 'audit_events_project_walk' : query.userId ? 'audit_events_actor_walk' : null;
  if (walk) {
    const ids = `SELECT \`AuditEvent\`.id FROM \`audit_events\` AS \`AuditEvent\` FORCE INDEX (${walk}) ${filter}`;
    return { from: pickedFrom(ids), params: [] };
  }
  const actions = await plainSelect<{ action: string }>(AuditEvent.sequelize!, MATCHING_ACTIONS, [
    likePrefix(query.action),
  ]);
  if (!actions.length) return null;
  const branch = `(SELECT id FROM audit_events FORCE INDEX (audit_events_action)
    WHERE action = ?${query.after ? ' AND id < ?' : ''} ORDER BY id DESC LIMIT ${offset + query.size + 1})`;
  const ids = `SELECT id FROM (${actions.map(() => branch).join(' UNION ALL ')}) branches
    ORDER BY id DESC LIMIT ${offset}, ${query.size + 1}`;
  return {
    from: pickedFrom(ids),
    params: actions.flatMap(({ action }) => (query.after ? [action, query.after] : [action])),
  };
}

const MATCHING_ACTIONS = 'SELECT DISTINCT action FROM audit_events WHERE action LIKE ?';

const pickedFrom = (ids: string): string =>
  `FROM (${ids}) picked
    STRAIGHT_JOIN \`audit_events\` AS \`AuditEvent\` ON \`AuditEvent\`.id = picked.id ${RECORDS.joins}
    ORDER BY \`AuditEvent\`.id DESC`;

// The same filter as the page, as `FROM … WHERE …` for the capped count (Sequelize builds it; the keyset left out).
function countSql(query: Omit<AuditQuery, 'page'>): { fromWhere: string; params: unknown[] } {
  // An action prefix within a project is counted one matching action at a time through the (action, project, time)
  // index, reading index entries only; as `action LIKE … AND project_id = …` MariaDB read every row of the project
  // to test its action (on 100,000 calcs: 29 ms against 1.5 ms for a project of 28,800 entries). The actions come
  // from the table itself (a loose index scan), so one never written by this version still counts.
  const byAction = Boolean(query.action && query.projectId);
  const sql = selectOne({ ...query, after: undefined, ...(byAction ? { action: undefined } : {}) });
  const from = sql.replace(/^SELECT 1 AS `one` /, '').replace(/;$/, '');
  if (!byAction) return { fromWhere: from, params: [] };
  const [table, where] = atFirst(from, ' WHERE ');
  return {
    fromWhere: `${table} JOIN (${MATCHING_ACTIONS}) actions ON actions.action = \`AuditEvent\`.action WHERE ${where}`,
    params: [likePrefix(query.action!)],
  };
}

/**
 * A statement Sequelize wrote, cut at the first `marker`: the clause itself, which comes before any value. A filter's
 * text may hold the same words inside its quoted value (`action=x FROM …`), so only the first is the clause.
 */
function atFirst(sql: string, marker: string): [string, string] {
  const at = sql.indexOf(marker);
  if (at < 0) throw new Error(`Sequelize wrote the audit statement without "${marker.trim()}": ${sql.slice(0, 200)}`);
  return [sql.slice(0, at), sql.slice(at + marker.length)];
}

// Attribute names become column names as findAll would map them (projectId → project_id).
const selectOne = (query: Omit<AuditQuery, 'page'>): string =>
  selectSql(AuditEvent, { attributes: [[AuditEvent.sequelize!.literal('1'), 'one']], where: auditWhere(query) });

/**
 * Everyone who can appear in the trail as an actor, for the auditor's person picker (compliance cannot list
 * accounts). Read from the people table, not grouped out of the trail, which would scan every audit entry.
 */
export async function auditPeople(ability: AppAbility): Promise<{ id: number; name: string }[]> {
  forbiddenCheck(ability).throwUnlessCan('read', 'AuditEvent');
  const order: [string, string][] = [
    ['displayName', 'ASC'],
    ['id', 'ASC'],
  ];
  const rows = await User.findAll({ attributes: ['id', 'displayName'], order });
  return rows.map((u) => ({ id: u.id, name: u.displayName }));
}

export async function checkAuditChain(ability: AppAbility): Promise<AuditChainStatus> {
  forbiddenCheck(ability).throwUnlessCan('read', 'AuditEvent');
  return { ...(await verifyAuditChain()), checkedAt: new Date().toISOString() };
}

export async function auditEntry(ability: AppAbility, id: number): Promise<AuditEventDto> {
  forbiddenCheck(ability).throwUnlessCan('read', 'AuditEvent');
  const event = await AuditEvent.findByPk(id);
  if (!event) throw AppError.notFound(`Audit entry ${id}`);
  return toAuditDto(event);
}
