import { ForbiddenError } from '@casl/ability';
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
import { withVerification } from '../independent/blind';
import { currentHashesOf } from './current-hash';
import type { SaveContext } from './save-context';

// Where the hashes were first written; callers keep importing them from here.
export { currentHashOf, currentHashesOf } from './current-hash';

/**
 * A revision as the screens show it; Server-Timing names its phases (read, hash, input, verification). `known` is
 * the row as a save has just written it, with its standard and people attached, its result expanded and the calc's
 * editors when the save knows them, and which rows hang off it (the answer to that save): then none of them is read
 * again, nor the signatures, findings or independent model it has none of (their writers all lock the revision row,
 * so none appeared while the save held it).
 */
export async function readRevision(
  ability: AppAbility,
  id: number,
  transaction?: Transaction,
  known?: { revision: Revision; result: unknown; editorIds: number[] | null; has?: SaveContext['has'] },
): Promise<RevisionDto> {
  const revision = known?.revision ?? (await timed('read', () => loadRevision(id, transaction)));
  ForbiddenError.from(ability).throwUnlessCan('read', 'Revision');
  const [result, signatures, findings, editorIds] = await timed('read', () =>
    Promise.all([
      known ? known.result : expandResult(Revision.sequelize!, revision.result, transaction),
      known?.has?.signatures === false
        ? []
        : Signature.findAll({ where: { revisionId: id }, order: [['signedAt', 'ASC']], transaction }),
      known?.has?.findings === false
        ? []
        : Finding.findAll({ where: { revisionId: id }, order: [['id', 'ASC']], transaction }),
      known?.editorIds ?? editorIdsOf(revision.calcId, transaction),
    ]),
  );
  // Independent of each other: asked together, so the database round trips overlap.
  const [currentHashes, names, inputIssues] = await Promise.all([
    timed('hash', () => currentHashesOf(revision, signatures, transaction, result, false)),
    timed('names', () => namesOf(findings, transaction)),
    timed('input', () => inputIssuesOf(revision)),
  ]);
  const dto = toRevisionDto(revision, { result, signatures, findings, editorIds, currentHashes, names, inputIssues });
  const noModel = known?.has?.independent_models === false;
  return timed('verification', () => withVerification(ability, revision, dto, transaction, noModel));
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
