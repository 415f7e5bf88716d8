import { ForbiddenError } from '@casl/ability';
import { Op, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { InputIssue, RevisionDto } from '../../shared/schemas/calc-dto';
import { validateCalcInput } from '../../shared/engine';
import { Calc, Finding, Project, Revision, Signature, User } from '../db/models';
import { toRevisionDto } from './calc-mapping';
import { editorIdsOf, loadRevision } from './calc-access';
import { computeRecord, contentHashOf, hashedContentOf } from './revision-content';
import { parseRuleSet } from '../rule-sets/rule-set-cache';

/** Recomputes the content hash from what is stored now, so tampering shows as a broken signature. */
export async function currentHashOf(revision: Revision, transaction?: Transaction): Promise<string | null> {
  if (!revision.result || !revision.checklist) return null;
  const calc = await Calc.findByPk(revision.calcId, { include: [Project], transaction }) as Calc & { Project: Project };
  return contentHashOf(hashedContentOf(calc, revision.label, JSON.parse(revision.input), JSON.parse(revision.result), JSON.parse(revision.checklist), revision.ruleSet));
}

export async function readRevision(ability: AppAbility, id: number, transaction?: Transaction): Promise<RevisionDto> {
  const revision = await loadRevision(id, transaction);
  ForbiddenError.from(ability).throwUnlessCan('read', 'Revision');
  const [signatures, findings, editorIds, currentHash] = await Promise.all([
    Signature.findAll({ where: { revisionId: id }, order: [['signedAt', 'ASC']], transaction }),
    Finding.findAll({ where: { revisionId: id }, order: [['id', 'ASC']], transaction }),
    editorIdsOf(revision.calcId, transaction),
    currentHashOf(revision, transaction),
  ]);
  const userIds = new Set(findings.flatMap((f) => [f.raisedBy, f.answeredBy, f.closedBy]).filter((v): v is number => v != null));
  const users = userIds.size ? await User.findAll({ where: { id: { [Op.in]: [...userIds] } }, attributes: ['id', 'displayName'], transaction }) : [];
  return toRevisionDto(revision, {
    signatures, findings, editorIds, currentHash,
    names: new Map(users.map((u) => [u.id, u.displayName])),
    inputIssues: await inputIssuesOf(revision),
  });
}

/**
 * Why a revision has no result. Valid input without a stored result could not be evaluated (a
 * value outside what the calculation can handle): evaluate again, rarely, to name where.
 */
async function inputIssuesOf(revision: Revision): Promise<InputIssue[]> {
  const input: unknown = JSON.parse(revision.input);
  const validated = validateCalcInput(input);
  if (!validated.ok) return validated.issues;
  if (revision.result !== null || !revision.ruleSet) return [];
  return (await computeRecord(input, parseRuleSet(revision.ruleSet))).inputIssues;
}
