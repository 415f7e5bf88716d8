import { ForbiddenError } from '@casl/ability';
import { Op, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { InputIssue, RevisionDto } from '../../shared/schemas/calc-dto';
import { validateCalcInput } from '../../shared/engine';
import { Attachment, Calc, Finding, Project, Revision, Signature, User } from '../db/models';
import { toRevisionDto } from './calc-mapping';
import { editorIdsOf, loadRevision } from './calc-access';
import { computeRecord, contentHashOf, hashedContentOf, signedAttachments } from './revision-content';
import { contentKeyOf, memoisedHash, memoisedValidation } from './content-hash-memo';
import { timed } from '../http/server-timing';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { expandResult } from './stored-result';
import { withVerification } from '../independent/blind';
import { lockedModelOf } from '../independent/signed-model';

/**
 * Recomputes the content hash from what is stored now, so tampering shows as a broken signature.
 * The hash covers the result as the engine returned it, with its units and formulas put back, and
 * (format 2, the default for the revision's own format) the attachment set as stored now.
 */
export async function currentHashOf(
  revision: Revision,
  transaction?: Transaction,
  result?: unknown,
  format = revision.contentFormat ?? 1,
): Promise<string | null> {
  if (!revision.result || !revision.checklist) return null;
  const [calc, expanded, attachments] = await Promise.all([
    Calc.findByPk(revision.calcId, {
      include: [Project],
      attributes: ['id', 'number', 'title', 'partRef', 'projectId'],
      transaction,
    }) as Promise<Calc & { Project: Project }>,
    result ?? expandResult(Revision.sequelize!, revision.result, transaction),
    format >= 2 ? Attachment.findAll({ where: { revisionId: revision.id }, transaction }) : [],
  ]);
  const model = format >= 3 ? await lockedModelOf(revision.id, transaction) : null;
  const key = contentKeyOf([
    format,
    ...[calc.Project.code, calc.number, calc.title, calc.partRef, revision.label],
    ...[revision.input, revision.result, revision.checklist],
    ...[revision.ruleSet?.code, revision.ruleSet?.version, revision.ruleSet?.contentHash],
    JSON.stringify(signedAttachments(attachments)),
    JSON.stringify(model),
  ]);
  return memoisedHash(key, () =>
    contentHashOf(
      hashedContentOf(
        calc,
        revision.label,
        JSON.parse(revision.input),
        expanded,
        JSON.parse(revision.checklist!),
        revision.ruleSet,
        format,
        attachments,
        model,
      ),
    ),
  );
}

/**
 * The current hash in every format a signature of this revision was made in, so each signature
 * is judged by the content it covered: tampering or a changed attachment set shows as broken.
 * `withOwnFormat: false` leaves out the revision's own format when no signature needs it (a plain
 * read of an unsigned revision then reads and hashes nothing: only signatures are judged by it).
 */
export async function currentHashesOf(
  revision: Revision,
  signatures: readonly Signature[],
  transaction?: Transaction,
  result?: unknown,
  withOwnFormat = true,
): Promise<Map<number, string | null>> {
  const own = withOwnFormat ? [revision.contentFormat ?? 1] : [];
  const formats = new Set([...own, ...signatures.map((s) => s.contentFormat ?? 1)]);
  const hashes = new Map<number, string | null>();
  for (const f of formats) hashes.set(f, await currentHashOf(revision, transaction, result, f));
  return hashes;
}

/** A revision as the screens show it; Server-Timing names its phases (read, hash, input, verification). */
export async function readRevision(ability: AppAbility, id: number, transaction?: Transaction): Promise<RevisionDto> {
  const revision = await timed('read', () => loadRevision(id, transaction));
  ForbiddenError.from(ability).throwUnlessCan('read', 'Revision');
  const [result, signatures, findings, editorIds] = await timed('read', () =>
    Promise.all([
      expandResult(Revision.sequelize!, revision.result, transaction),
      Signature.findAll({ where: { revisionId: id }, order: [['signedAt', 'ASC']], transaction }),
      Finding.findAll({ where: { revisionId: id }, order: [['id', 'ASC']], transaction }),
      editorIdsOf(revision.calcId, transaction),
    ]),
  );
  // Independent of each other: asked together, so the database round trips overlap.
  const [currentHashes, names, inputIssues] = await Promise.all([
    timed('hash', () => currentHashesOf(revision, signatures, transaction, result, false)),
    timed('names', () => namesOf(findings, transaction)),
    timed('input', () => inputIssuesOf(revision)),
  ]);
  const dto = toRevisionDto(revision, { result, signatures, findings, editorIds, currentHashes, names, inputIssues });
  return timed('verification', () => withVerification(ability, revision, dto, transaction));
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
