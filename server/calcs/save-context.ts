import { plainSelect } from '../db/plain-query';
import type { Transaction } from 'sequelize';
import { Calc, Project, Revision } from '../db/models';
import { attachKnown } from './calc-access';
import { columnsOf, instanceOf } from '../db/plain-rows';
import { AppError } from '../errors/app-error';
import { revisionRuleSet, type RuleSetStamp } from '../rule-sets/rule-set-cache';
import type { HashSources } from './current-hash';

/** What a save reads besides the locked revision row, in one statement. */
export interface SaveContext {
  calc: HashSources['calc'];
  project: Project | undefined;
  /** The saving person is already among the calc's editors (else the save adds them). */
  edited: boolean;
  /** The calc's editors as `editorIdsOf` lists them, or null when the list has to be read (see below). */
  editorIds: number[] | null;
  /** Display names of the revision's author, checker and approver (who exist). */
  names: Map<number, string>;
  /** What identifies the standard's row as stored: its document is taken from memory when the stamp matches. */
  ruleSet: RuleSetStamp | null;
  /** Which rows hang off the revision: those it has none of are not read for the hash or the answer. */
  has: Record<(typeof HANGING)[number], boolean>;
}

export const PEOPLE = ['author', 'checker', 'approver'] as const;
// Rows whose writers all lock the revision row first, so none appears while a save holds it.
export const HANGING = ['signatures', 'findings', 'attachments', 'independent_models'] as const;

/**
 * What a context statement (a save's, or a plain read's in revision-read-context.ts) read besides its rows, by
 * column: the people's names (a column per role), the calc's editors (`editorList`, cut at group_concat_max_len, so
 * `editorCount` tells a cut list: null then, to be read whole) and which rows hang off the revision (a column each).
 */
export function contextColumns(revision: Revision, column: (name: string) => unknown) {
  const names = new Map<number, string>();
  for (const role of PEOPLE) {
    const id = revision[`${role}Id`];
    if (id != null && column(role) != null) names.set(id, String(column(role)));
  }
  const listed = column('editorList');
  const list = listed == null ? [] : String(listed).split(',').map(Number);
  return {
    names,
    editorIds: list.length === Number(column('editorCount')) ? list : null,
    has: Object.fromEntries(HANGING.map((t) => [t, Number(column(t)) === 1])) as SaveContext['has'],
  };
}

/**
 * The calc of a locked revision with its project, whether `userId` already edited it, the calc's editors, the names
 * of the revision's people and its standard's stamp: read once, where a save used six statements (the project's
 * status, the calc for the hash, the editor row, the editor list, the people, the standard with its document).
 * A plain read like assertProjectOpen's; the revision row's lock already orders the saves of one calc. Sent as a
 * plain statement (`server/db/plain-rows.ts`): through the model it cost about as much CPU as the engine run.
 */
export async function saveContextOf(
  revision: Revision,
  userId: number,
  transaction: Transaction,
): Promise<SaveContext> {
  const [calcKey, userKey, ruleSetKey] = [Number(revision.calcId), Number(userId), Number(revision.ruleSetId)];
  const editors = `FROM calc_editors e WHERE e.calc_id = ${calcKey}`;
  const ruleSet = (column: string) => `(SELECT ${column} FROM rule_sets WHERE id = ${ruleSetKey})`;
  const people = PEOPLE.map((role) => {
    const id = revision[`${role}Id`];
    return `${id == null ? 'NULL' : `(SELECT display_name FROM users WHERE id = ${Number(id)})`} AS ${role}`;
  });
  const [row] = await plainSelect<Record<string, unknown>>(
    Calc.sequelize!,
    [
      'SELECT c.id, c.number, c.title, c.part_ref AS partRef, c.project_id AS projectId,',
      'p.id AS projectKey, p.code AS projectCode, p.status AS projectStatus,',
      `EXISTS(SELECT 1 ${editors} AND e.user_id = ${userKey}) AS edited,`,
      // GROUP_CONCAT is cut at group_concat_max_len: the count tells a cut list, which is then read whole.
      `(SELECT GROUP_CONCAT(e.user_id ORDER BY e.user_id) ${editors}) AS editorList,`,
      `(SELECT COUNT(*) ${editors}) AS editorCount,`,
      `${ruleSet('lock_version')} AS ruleSetLockVersion, ${ruleSet('content_hash')} AS ruleSetContentHash,`,
      `${people.join(', ')},`,
      HANGING.map((t) => `EXISTS(SELECT 1 FROM ${t} WHERE revision_id = ${Number(revision.id)}) AS ${t}`).join(', '),
      `FROM calcs c LEFT JOIN projects p ON p.id = c.project_id WHERE c.id = ${calcKey}`,
    ].join('\n'),
    [],
    transaction,
  );
  if (!row) throw AppError.notFound(`Calc ${revision.calcId}`);
  const lockVersion = row.ruleSetLockVersion;
  return {
    ...calcOf(row),
    ...contextColumns(revision, (name) => row[name]),
    edited: Number(row.edited) === 1,
    ruleSet:
      lockVersion == null
        ? null
        : { id: ruleSetKey, lockVersion: Number(lockVersion), contentHash: String(row.ruleSetContentHash) },
  };
}

// What a save uses of the calc (the hash covers its number, title and part reference).
const CALC_ATTRIBUTES = ['id', 'number', 'title', 'partRef', 'projectId'];

/** The calc with its project (id, code and status), as an include of the project gives it. */
function calcOf(row: Record<string, unknown>): { calc: SaveContext['calc']; project: Project | undefined } {
  const calc = instanceOf(Calc, Object.fromEntries(CALC_ATTRIBUTES.map((a) => [a, row[a]])));
  const project =
    row.projectKey == null
      ? undefined
      : instanceOf(Project, { id: row.projectKey, code: row.projectCode, status: row.projectStatus });
  (calc.dataValues as Record<string, unknown>).Project = project;
  (calc as unknown as Record<string, unknown>).Project = project;
  return { calc: calc as SaveContext['calc'], project };
}

let lockedSql: string | undefined;

/**
 * The locked row with its standard and people attached, as loadRevision gives it, and the save's context: the
 * standard's row comes from memory while its stamp (read in the context statement) is unchanged.
 */
export async function lockWithContext(revisionId: number, userId: number, transaction: Transaction) {
  lockedSql ??= `SELECT ${columnsOf(Revision, 'r', REPLACED)} FROM revisions r WHERE r.id = ? FOR UPDATE`;
  const [row] = await plainSelect<Record<string, unknown>>(Revision.sequelize!, lockedSql, [revisionId], transaction);
  if (!row) throw AppError.notFound(`Revision ${revisionId}`);
  const revision = instanceOf(Revision, row);
  const context = await saveContextOf(revision, userId, transaction);
  attachKnown(revision, context.ruleSet && (await revisionRuleSet(context.ruleSet, transaction)), context.names);
  return { revision, context };
}

/** What a save replaces without reading it; a run that finds its save already stored reads them (withStoredResult). */
export const REPLACED = ['result', 'checklist'] as const;

/** The result and checklist of a row locked without them, put on it as stored. */
export async function withStoredResult(revision: Revision, transaction: Transaction): Promise<Revision> {
  const row = await Revision.findByPk(revision.id, { attributes: [...REPLACED], transaction });
  revision.set({ result: row?.result ?? null, checklist: row?.checklist ?? null }, { raw: true });
  return revision;
}

/** The editor list once `userId` is added, in the order editorIdsOf reads it. */
export function withEditor(editorIds: number[] | null, userId: number): number[] | null {
  return editorIds && [...editorIds, userId].sort((a, b) => a - b);
}
