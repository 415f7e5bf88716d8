import { literal, type Transaction } from 'sequelize';
import { Calc, Project, Revision } from '../db/models';
import { attachKnown, lockRevision } from './calc-access';
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

const PEOPLE = ['author', 'checker', 'approver'] as const;
// Rows whose writers all lock the revision row first, so none appears while a save holds it.
const HANGING = ['signatures', 'findings', 'attachments', 'independent_models'] as const;

/**
 * The calc of a locked revision with its project, whether `userId` already edited it, the calc's editors, the names
 * of the revision's people and its standard's stamp: read once, where a save used six statements (the project's
 * status, the calc for the hash, the editor row, the editor list, the people, the standard with its document).
 * A plain read like assertProjectOpen's; the revision row's lock already orders the saves of one calc.
 */
export async function saveContextOf(
  revision: Revision,
  userId: number,
  transaction: Transaction,
): Promise<SaveContext> {
  const [calcKey, userKey, ruleSetKey] = [Number(revision.calcId), Number(userId), Number(revision.ruleSetId)];
  const editors = `FROM calc_editors e WHERE e.calc_id = ${calcKey}`;
  const ruleSet = (column: string) => literal(`(SELECT ${column} FROM rule_sets WHERE id = ${ruleSetKey})`);
  const people = PEOPLE.map((role) => {
    const id = revision[`${role}Id`];
    return [literal(id == null ? 'NULL' : `(SELECT display_name FROM users WHERE id = ${Number(id)})`), role];
  });
  const calc = (await Calc.findByPk(revision.calcId, {
    attributes: [
      ...['id', 'number', 'title', 'partRef', 'projectId'],
      [literal(`EXISTS(SELECT 1 ${editors} AND e.user_id = ${userKey})`), 'edited'],
      // GROUP_CONCAT is cut at group_concat_max_len: the count tells a cut list, which is then read whole.
      [literal(`(SELECT GROUP_CONCAT(e.user_id ORDER BY e.user_id) ${editors})`), 'editorList'],
      [literal(`(SELECT COUNT(*) ${editors})`), 'editorCount'],
      [ruleSet('lock_version'), 'ruleSetLockVersion'],
      [ruleSet('content_hash'), 'ruleSetContentHash'],
      ...people,
      ...HANGING.map((t) => [literal(`EXISTS(SELECT 1 FROM ${t} WHERE revision_id = ${Number(revision.id)})`), t]),
    ] as never,
    include: [{ model: Project, attributes: ['id', 'code', 'status'] }],
    transaction,
  })) as (HashSources['calc'] & { Project?: Project }) | null;
  if (!calc) throw AppError.notFound(`Calc ${revision.calcId}`);
  const raw = (key: string) => calc.get(key) as string | number | null;
  const list = raw('editorList') == null ? [] : String(raw('editorList')).split(',').map(Number);
  const names = new Map<number, string>();
  for (const role of PEOPLE) {
    const id = revision[`${role}Id`];
    if (id != null && raw(role) != null) names.set(id, String(raw(role)));
  }
  const lockVersion = raw('ruleSetLockVersion');
  return {
    calc,
    project: calc.Project,
    edited: Number(raw('edited')) === 1,
    editorIds: list.length === Number(raw('editorCount')) ? list : null,
    names,
    ruleSet:
      lockVersion == null
        ? null
        : { id: ruleSetKey, lockVersion: Number(lockVersion), contentHash: String(raw('ruleSetContentHash')) },
    has: Object.fromEntries(HANGING.map((t) => [t, Number(raw(t)) === 1])) as SaveContext['has'],
  };
}

/**
 * The locked row with its standard and people attached, as loadRevision gives it, and the save's context: the
 * standard's row comes from memory while its stamp (read in the context statement) is unchanged.
 */
export async function lockWithContext(revisionId: number, userId: number, transaction: Transaction) {
  const revision = await lockRevision(revisionId, transaction, [...REPLACED]);
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
