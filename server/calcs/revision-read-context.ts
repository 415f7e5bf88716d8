import { plainSelect } from '../db/plain-query';
import { columnsOf, instanceOf } from '../db/plain-rows';
import { Revision, RuleSetRecord, Signature } from '../db/models';
import { AppError } from '../errors/app-error';
import { attachKnown, editorIdsOf } from './calc-access';
import { REVISION_RULE_SET_ATTRIBUTES, revisionRuleSet } from '../rule-sets/rule-set-cache';
import type { HashSources } from './current-hash';
import { HANGING, PEOPLE, contextColumns, type SaveContext } from './save-context';

/** What a plain read of a revision reads with its row, in one statement. */
export interface ReadContext {
  /** The row with its standard and its people attached, as loadRevision gives it. */
  revision: Revision;
  calc: HashSources['calc'];
  editorIds: number[];
  /** Which rows hang off the revision: those it has none of are not read. */
  has: SaveContext['has'];
}

const RULE_SET_COLUMNS = {
  id: 'id',
  code: 'code',
  version: 'version',
  title: 'title',
  contentHash: 'content_hash',
  lockVersion: 'lock_version',
};

let contextSql: string | undefined;
let signaturesSql: string | undefined;

/**
 * A revision as a screen, a report or an evidence pack reads it (no transaction, no lock), with what took six
 * statements read in one: the row, its standard's stamp (the ~15 kB document comes from memory while the stamp
 * matches), its people's names, the calc and project code its hash covers, the calc's editors and which rows hang
 * off it. One statement is one consistent view, so the state and the rows hanging off it cannot disagree, where
 * separate statements could each see a different moment.
 */
export async function readContextOf(id: number): Promise<ReadContext> {
  contextSql ??= contextStatement();
  const [row] = await plainSelect<Record<string, unknown>>(Revision.sequelize!, contextSql, [id]);
  if (!row) throw AppError.notFound(`Revision ${id}`);
  return contextOfRow(row);
}

function contextStatement(): string {
  const editors = 'FROM calc_editors e WHERE e.calc_id = r.calc_id';
  return [
    `SELECT ${columnsOf(Revision, 'r')},`,
    Object.entries(RULE_SET_COLUMNS)
      .map(([name, column]) => `s.${column} AS \`ctx.ruleSet.${name}\``)
      .join(', ') + ',',
    PEOPLE.map((role) => `${role}.display_name AS \`ctx.${role}\``).join(', ') + ',',
    'c.number AS `ctx.number`, c.title AS `ctx.title`, c.part_ref AS `ctx.partRef`, c.project_id AS `ctx.projectId`,',
    'p.code AS `ctx.projectCode`,',
    // Read by contextColumns (save-context.ts), as a save's context statement reads them.
    `(SELECT GROUP_CONCAT(e.user_id ORDER BY e.user_id) ${editors}) AS \`ctx.editorList\`,`,
    `(SELECT COUNT(*) ${editors}) AS \`ctx.editorCount\`,`,
    HANGING.map((t) => `EXISTS(SELECT 1 FROM ${t} h WHERE h.revision_id = r.id) AS \`ctx.${t}\``).join(', '),
    'FROM revisions r JOIN calcs c ON c.id = r.calc_id JOIN projects p ON p.id = c.project_id',
    'LEFT JOIN rule_sets s ON s.id = r.rule_set_id',
    ...PEOPLE.map((role) => `LEFT JOIN users ${role} ON ${role}.id = r.${role}_id`),
    'WHERE r.id = ?',
  ].join('\n');
}

async function contextOfRow(row: Record<string, unknown>): Promise<ReadContext> {
  const own: Record<string, unknown> = {};
  const ctx: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(row)) {
    if (key.startsWith('ctx.')) ctx[key.slice(4)] = value;
    else own[key] = value;
  }
  const revision = instanceOf(Revision, own);
  const { names, editorIds, has } = contextColumns(revision, (name) => ctx[name]);
  attachKnown(revision, await ruleSetOf(ctx), names);
  const calc = {
    id: revision.calcId,
    number: ctx.number,
    title: ctx.title,
    partRef: ctx.partRef,
    projectId: ctx.projectId,
    Project: { code: ctx.projectCode },
  } as unknown as HashSources['calc'];
  return {
    revision,
    calc,
    editorIds: editorIds ?? (await editorIdsOf(revision.calcId)),
    has,
  };
}

/**
 * The standard's row with its document, from memory while its stamp is unchanged (rule-set-cache.ts); the identity a
 * signature's hash covers (code, version) and the title shown are compared with the row as read now, so a row changed
 * behind the app's back is read afresh rather than shown as remembered.
 */
async function ruleSetOf(ctx: Record<string, unknown>): Promise<RuleSetRecord | null> {
  if (ctx['ruleSet.id'] == null) return null;
  const live = (k: keyof typeof RULE_SET_COLUMNS) => ctx[`ruleSet.${k}`];
  const id = Number(live('id'));
  const stamp = { id, lockVersion: Number(live('lockVersion')), contentHash: String(live('contentHash')) };
  const known = await revisionRuleSet(stamp);
  const same = known && known.code === live('code') && known.version === Number(live('version'));
  if (same && known.title === live('title')) return known;
  return RuleSetRecord.findByPk(id, { attributes: REVISION_RULE_SET_ATTRIBUTES });
}

/** A revision's signatures in signing order, as `Signature.findAll` gives them, through one plain statement. */
export async function signaturesOf(revisionId: number): Promise<Signature[]> {
  signaturesSql ??= `SELECT ${columnsOf(Signature, 'g')} FROM signatures g WHERE g.revision_id = ? ORDER BY g.signed_at, g.id`;
  const rows = await plainSelect<Record<string, unknown>>(Signature.sequelize!, signaturesSql, [revisionId]);
  return rows.map((r) => instanceOf(Signature, r));
}
