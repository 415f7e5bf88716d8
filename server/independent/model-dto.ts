import type { IndependentModelDto } from '../../shared/schemas/independent-model.schema';
import type { Comparison } from '../../shared/verification';
import { validateCalcInput } from '../../shared/engine';
import type { IndependentModel } from '../db/models';

/** The checker's model as the API gives it: the same parts as a revision's own content. */
export function toModelDto(m: IndependentModel, checkerName: string): IndependentModelDto {
  const input = JSON.parse(m.input) as Record<string, unknown>;
  const validated = validateCalcInput(input);
  return {
    id: m.id,
    revisionId: m.revisionId,
    checker: { id: m.checkerId, name: checkerName },
    state: m.lockedAt ? 'locked' : 'open',
    input,
    result: m.result ? JSON.parse(m.result) : null,
    checklist: m.checklist ? JSON.parse(m.checklist) : null,
    verdict: m.verdict,
    inputIssues: validated.ok ? (m.result ? [] : [{ path: '', message: 'could not be evaluated' }]) : validated.issues,
    lockedAt: m.lockedAt?.toISOString() ?? null,
    modelHash: m.modelHash,
    authorHash: m.authorHash,
    comparison: m.comparison ? (JSON.parse(m.comparison) as Comparison) : null,
    agrees: m.agrees,
    lockVersion: m.lockVersion,
    updatedAt: m.updatedAt.toISOString(),
  };
}
