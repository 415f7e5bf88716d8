import { ForbiddenError } from '@casl/ability';
import { Op, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import { validateCalcInput } from '../../shared/engine';
import { Attachment, Calc, Finding, Project, Revision, Signature, User } from '../db/models';
import { toRevisionDto } from './calc-mapping';
import { editorIdsOf, loadRevision } from './calc-access';
import { contentHashOf, hashedContentOf } from './revision-content';

/** The stored content hashed in one format (default: the revision's own), attachments as stored now. */
export async function currentHashOf(revision: Revision, transaction?: Transaction, format = revision.contentFormat ?? 1): Promise<string | null> {
  if (!revision.result || !revision.checklist) return null;
  const calc = await Calc.findByPk(revision.calcId, { include: [Project], transaction }) as Calc & { Project: Project };
  const attachments = format >= 2 ? await Attachment.findAll({ where: { revisionId: revision.id }, transaction }) : [];
  return contentHashOf(hashedContentOf(calc, revision.label, JSON.parse(revision.input), JSON.parse(revision.result), JSON.parse(revision.checklist), revision.ruleSet, format, attachments));
}

/**
 * The current hash in every format a signature of this revision was made in, so each signature
 * is judged by the content it covered: tampering or a changed attachment set shows as broken.
 */
export async function currentHashesOf(revision: Revision, signatures: readonly Signature[], transaction?: Transaction): Promise<Map<number, string | null>> {
  const formats = new Set([revision.contentFormat ?? 1, ...signatures.map((s) => s.contentFormat ?? 1)]);
  const hashes = new Map<number, string | null>();
  for (const f of formats) hashes.set(f, await currentHashOf(revision, transaction, f));
  return hashes;
}

export async function readRevision(ability: AppAbility, id: number, transaction?: Transaction): Promise<RevisionDto> {
  const revision = await loadRevision(id, transaction);
  ForbiddenError.from(ability).throwUnlessCan('read', 'Revision');
  const [signatures, findings, editorIds] = await Promise.all([
    Signature.findAll({ where: { revisionId: id }, order: [['signedAt', 'ASC']], transaction }),
    Finding.findAll({ where: { revisionId: id }, order: [['id', 'ASC']], transaction }),
    editorIdsOf(revision.calcId, transaction),
  ]);
  const currentHashes = await currentHashesOf(revision, signatures, transaction);
  const userIds = new Set(findings.flatMap((f) => [f.raisedBy, f.answeredBy, f.closedBy]).filter((v): v is number => v != null));
  const users = userIds.size ? await User.findAll({ where: { id: { [Op.in]: [...userIds] } }, attributes: ['id', 'displayName'], transaction }) : [];
  const validated = validateCalcInput(JSON.parse(revision.input));
  return toRevisionDto(revision, {
    signatures, findings, editorIds, currentHashes,
    names: new Map(users.map((u) => [u.id, u.displayName])),
    inputIssues: validated.ok ? [] : validated.issues,
  });
}
