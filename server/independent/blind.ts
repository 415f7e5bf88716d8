import type { Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import type { RevisionVerification } from '../../shared/schemas/independent-model.schema';
import { verificationNeed, type VerificationNeed } from '../../shared/verification';
import { IndependentModel, User, type Revision } from '../db/models';
import { parseRuleSet } from '../rule-sets/rule-set-cache';
import { signedModelOf } from './model-hash';
import { viewerOf, type Viewer } from './viewer';

/** Before the check is signed, a checker who has not locked a model of their own works blind. */
export const BLIND_STATES: readonly string[] = ['draft', 'returned', 'in_check'];

export function needOf(revision: Revision): VerificationNeed {
  const doc = revision.ruleSet ? parseRuleSet(revision.ruleSet) : null;
  return verificationNeed(doc?.verification, revision.ruleSet?.code ?? 'The standard', JSON.parse(revision.input));
}

/**
 * The blind rule, in one place: a possible checker of this revision (checker role, not its author)
 * sees none of the author's numbers until their own independent model is locked. Approvers,
 * compliance and the author are not blind; a person who is also a checker is, to be safe.
 */
export function isBlind(
  viewer: Viewer,
  revision: Pick<Revision, 'authorId' | 'status'>,
  need: VerificationNeed,
  model: IndependentModel | null,
): boolean {
  if (need.method !== 'independent-model' || !viewer.mayCheck || viewer.id === revision.authorId) return false;
  if (!BLIND_STATES.includes(revision.status)) return false;
  return !(model?.lockedAt && model.checkerId === viewer.id);
}

export async function modelOfRevision(revisionId: number, transaction?: Transaction): Promise<IndependentModel | null> {
  return IndependentModel.findOne({ where: { revisionId }, transaction });
}

/** The verification part of a revision read, for this reader. */
export async function verificationFor(
  ability: AppAbility,
  revision: Revision,
  transaction?: Transaction,
  noModel = false,
): Promise<RevisionVerification> {
  const need = needOf(revision);
  const model = noModel ? null : await modelOfRevision(revision.id, transaction);
  const checker = model
    ? await User.findByPk(model.checkerId, { attributes: ['id', 'displayName'], transaction })
    : null;
  const name = checker?.displayName ?? 'unknown';
  const differences = model?.comparison
    ? (JSON.parse(model.comparison) as { rows: { agrees: boolean }[] }).rows.filter((r) => !r.agrees).length
    : null;
  return {
    need,
    blind: isBlind(viewerOf(ability), revision, need, model),
    model: model
      ? {
          state: model.lockedAt ? 'locked' : 'open',
          checker: { id: model.checkerId, name },
          lockedAt: model.lockedAt?.toISOString() ?? null,
          agrees: model.agrees,
          differences,
        }
      : null,
    signed: model ? await signedModelOf(model, name, transaction) : null,
  };
}

/** A revision read with the author's numbers left out, for a blind checker: what they may see stays. */
export function blindRead(dto: RevisionDto): RevisionDto {
  return {
    ...dto,
    input: {},
    result: null,
    checklist: null,
    verdict: null,
    inputIssues: [],
    // Findings and their answers quote the author's values; the checker reads them after locking.
    findings: [],
    manualItems: {},
  };
}

/**
 * Adds the verification part to a revision read and applies the blind rule (server/calcs/revision-read.ts); `noModel`
 * when the caller knows the revision has no independent model (a save's answer), so none is looked for.
 */
export async function withVerification(
  ability: AppAbility,
  revision: Revision,
  dto: RevisionDto,
  transaction?: Transaction,
  noModel = false,
): Promise<RevisionDto> {
  const verification = await verificationFor(ability, revision, transaction, noModel);
  if (!verification.blind) return { ...dto, verification };
  return { ...blindRead(dto), verification: { ...verification, signed: null } };
}
