import { ForbiddenError } from '@casl/ability';
import { QueryTypes } from 'sequelize';
import type { AuditChainStatus, AuditEventDto, AuditQuery } from '../../shared/schemas/audit.schema';
import type { KeysetPage } from '../../shared/schemas/common.schema';
import type { AppAbility } from '../../shared/authz/app-ability';
import { AuditEvent, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { cappedCount } from '../http/keyset';
import { verifyAuditChain } from './audit.service';
import { auditWhere } from './audit-filter';
import { likePrefix } from '../db/like-pattern';
import { describeRecords, recordOf } from './audit-records';
import { selectSql } from '../db/plain-rows';

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

/** Newest first, paged by keyset (`after` the last id shown); counted up to a cap on the first page only. */
export async function listAudit(
  ability: AppAbility,
  query: Omit<AuditQuery, 'page'> & { page?: number },
): Promise<KeysetPage<AuditEventDto>> {
  ForbiddenError.from(ability).throwUnlessCan('read', 'AuditEvent');
  const where = auditWhere(query);
  const sequelize = AuditEvent.sequelize!;
  const [rows, counted] = await Promise.all([
    // Sent plain: through findAll, even with plain rows, the statement cost more CPU than the rest of the answer.
    sequelize.query<Listed>(
      selectSql(AuditEvent, {
        where,
        attributes: [...LIST_ATTRIBUTES, [sequelize.literal('diff IS NOT NULL'), 'hasDiff']],
        order: [['id', 'DESC']],
        offset: query.after ? 0 : (query.page ?? 0) * query.size,
        limit: query.size + 1,
      }),
      { type: QueryTypes.SELECT },
    ),
    query.after ? null : countAudit(query),
  ]);
  const items = rows.slice(0, query.size);
  const refs = await describeRecords(sequelize, items);
  return {
    items: items.map((r) => ({ ...toAuditDto(r), record: recordOf(refs, r) })),
    size: query.size,
    total: counted?.total ?? null,
    totalIsAtLeast: counted?.totalIsAtLeast ?? false,
    next: rows.length > query.size ? String(items[items.length - 1].id) : null,
  };
}

// The same filter as the page, as SQL for the capped count (Sequelize builds it; the page's keyset is left out).
async function countAudit(query: Omit<AuditQuery, 'page'>) {
  // An action prefix within a project is counted one matching action at a time through the (action, project, time)
  // index, reading index entries only; as `action LIKE … AND project_id = …` MariaDB read every row of the project
  // to test its action (on 100,000 calcs: 29 ms against 1.5 ms for a project of 28,800 entries). The actions come
  // from the table itself (a loose index scan), so one never written by this version still counts.
  const byAction = Boolean(query.action && query.projectId);
  const sql = selectOne({ ...query, after: undefined, ...(byAction ? { action: undefined } : {}) });
  const from = sql.replace(/^SELECT 1 AS `one` /, '').replace(/;$/, '');
  if (!byAction) return cappedCount(AuditEvent.sequelize!, from, []);
  const [table, where] = from.split(/ WHERE /);
  const actions = 'SELECT DISTINCT action FROM audit_events WHERE action LIKE ?';
  return cappedCount(
    AuditEvent.sequelize!,
    `${table} JOIN (${actions}) actions ON actions.action = \`AuditEvent\`.action WHERE ${where}`,
    [likePrefix(query.action!)],
  );
}

// Attribute names become column names as findAll would map them (projectId → project_id).
const selectOne = (query: Omit<AuditQuery, 'page'>): string =>
  selectSql(AuditEvent, { attributes: [[AuditEvent.sequelize!.literal('1'), 'one']], where: auditWhere(query) });

/**
 * Everyone who can appear in the trail as an actor, for the auditor's person picker (compliance cannot list
 * accounts). Read from the people table, not grouped out of the trail, which would scan every audit entry.
 */
export async function auditPeople(ability: AppAbility): Promise<{ id: number; name: string }[]> {
  ForbiddenError.from(ability).throwUnlessCan('read', 'AuditEvent');
  const order: [string, string][] = [
    ['displayName', 'ASC'],
    ['id', 'ASC'],
  ];
  const rows = await User.findAll({ attributes: ['id', 'displayName'], order });
  return rows.map((u) => ({ id: u.id, name: u.displayName }));
}

export async function checkAuditChain(ability: AppAbility): Promise<AuditChainStatus> {
  ForbiddenError.from(ability).throwUnlessCan('read', 'AuditEvent');
  return { ...(await verifyAuditChain()), checkedAt: new Date().toISOString() };
}

export async function auditEntry(ability: AppAbility, id: number): Promise<AuditEventDto> {
  ForbiddenError.from(ability).throwUnlessCan('read', 'AuditEvent');
  const event = await AuditEvent.findByPk(id);
  if (!event) throw AppError.notFound(`Audit entry ${id}`);
  return toAuditDto(event);
}
