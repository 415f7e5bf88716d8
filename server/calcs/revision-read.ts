import { Op, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { InputIssue, RevisionDto } from '../../shared/schemas/calc-dto';
import { validateCalcInput } from '../../shared/engine';
import { Finding, Revision, Signature, User } from '../db/models';
import { toRevisionDto } from './calc-mapping';
import { editorIdsOf, loadRevision } from './calc-access';
import { computeRecord } from './revision-content';
import { memoisedValidation } from './content-hash-memo';
import { timed } from '../http/server-timing';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { expandResult } from './stored-result';
import { StoredJson } from './revision-answer';
import { expandChecklist } from './stored-checklist';
import { withVerification } from '../independent/blind';
import { currentHashesOf, type HashSources } from './current-hash';
import { readContextOf, signaturesOf } from './revision-read-context';
import type { SaveContext } from './save-context';
import type { RevisionForm } from '../../shared/schemas/revision-form';
import { forbiddenCheck } from '../authz/forbidden-check';

// Where the hashes were first written; callers keep importing them from here.
export { currentHashOf, currentHashesOf } from './current-hash';

/**
 * A revision as the screens show it; Server-Timing names its phases (read, hash, input, verification). In the
 * `stored` form (the browser's: shared/schemas/revision-form.ts) its result and checklist are the stored texts, sent
 * as they are (revision-answer.ts), and the result is expanded only if its hash must be computed afresh. `known` is
 * the row as a save has just written it, with its standard and people attached, its result expanded and the calc's
 * editors when the save knows them, and which rows hang off it (the answer to that save): then none of them is read
 * again, nor the signatures, findings or independent model it has none of (their writers all lock the revision row,
 * so none appeared while the save held it). A plain read (no transaction) reads the same in one statement
 * (readContextOf); a read inside a write's transaction locks the row and reads the rest as before.
 */
export async function readRevision(
  ability: AppAbility,
  id: number,
  transaction?: Transaction,
  known?: Known,
  form: RevisionForm = 'full',
): Promise<RevisionDto> {
  const context = known ?? (await timed('read', () => contextOf(id, transaction)));
  const { revision, has } = context;
  forbiddenCheck(ability).throwUnlessCan('read', 'Revision');
  const stored = form === 'stored';
  const [result, signatures, findings, editorIds] = await timed('read', () =>
    Promise.all([
      // In the stored form a result is expanded only for a hash computed afresh (a save's, known, is passed on).
      context.result !== undefined
        ? context.result
        : stored
          ? undefined
          : expandResult(Revision.sequelize!, revision.result, transaction),
      has?.signatures === false
        ? []
        : transaction
          ? Signature.findAll({ where: { revisionId: id }, order: [['signedAt', 'ASC']], transaction })
          : signaturesOf(id),
      has?.findings === false
        ? []
        : Finding.findAll({ where: { revisionId: id }, order: [['id', 'ASC']], transaction }),
      context.editorIds ?? editorIdsOf(revision.calcId, transaction),
    ]),
  );
  const hashKnown = {
    calc: context.calc,
    attachments: has?.attachments === false ? [] : undefined,
    model: has?.independent_models === false ? null : undefined,
  };
  // Independent of each other: asked together, so the database round trips overlap.
  const [currentHashes, names, inputIssues] = await Promise.all([
    timed('hash', () => currentHashesOf(revision, signatures, transaction, result, false, hashKnown)),
    timed('names', () => namesOf(findings, transaction)),
    timed('input', () => inputIssuesOf(revision)),
  ]);
  // A hash computed for these texts (now, or remembered under their digest) parsed them, and a save has just written
  // them from computed values (stringifyFinite): they need no parse again.
  const parsed = context.written === true || [...currentHashes.values()].some((h) => h !== null);
  const asStored = (text: string | null) => text && (parsed ? StoredJson.parsed(text) : new StoredJson(text));
  const dto = toRevisionDto(revision, {
    result: stored ? asStored(revision.result) : result,
    checklist: stored ? asStored(revision.checklist) : expandChecklist(revision.checklist),
    signatures,
    findings,
    editorIds,
    currentHashes,
    names,
    inputIssues,
  });
  const noModel = has?.independent_models === false;
  return timed('verification', () => withVerification(ability, revision, dto, transaction, noModel));
}

/** What a read starts from: the row with its standard and people, and what it already knows besides. */
interface Known {
  revision: Revision;
  /** The expanded result, when known (undefined: expand the stored one). */
  result?: unknown;
  editorIds: number[] | null;
  has?: SaveContext['has'];
  calc?: HashSources['calc'];
  /** The result and checklist texts are the ones this process has just written from computed values (a save). */
  written?: boolean;
}

async function contextOf(id: number, transaction?: Transaction): Promise<Known> {
  if (!transaction) return readContextOf(id);
  return { revision: await loadRevision(id, transaction), editorIds: null };
}

async function namesOf(findings: readonly Finding[], transaction?: Transaction): Promise<Map<number, string>> {
  const userIds = new Set(
    findings.flatMap((f) => [f.raisedBy, f.answeredBy, f.closedBy]).filter((v): v is number => v != null),
  );
  const users = userIds.size
    ? await User.findAll({ where: { id: { [Op.in]: [...userIds] } }, attributes: ['id', 'displayName'], transaction })
    : [];
  return new Map(users.map((u) => [u.id, u.displayName]));
}

/**
 * Why a revision has no result. Valid input without a stored result could not be evaluated (a
 * value outside what the calculation can handle): evaluate again, rarely, to name where.
 */
async function inputIssuesOf(revision: Revision): Promise<InputIssue[]> {
  const issues = memoisedValidation(revision.input, (text) => {
    const validated = validateCalcInput(JSON.parse(text));
    return validated.ok ? [] : validated.issues;
  });
  if (issues.length || revision.result !== null || !revision.ruleSet) return issues;
  return (await computeRecord(JSON.parse(revision.input), parseRuleSet(revision.ruleSet))).inputIssues;
}
