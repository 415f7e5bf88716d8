import type { IndependentModelDto } from '../../shared/schemas/independent-model.schema';
import type { Comparison } from '../../shared/verification';
import { validateCalcInput } from '../../shared/engine';
import type { IndependentModel } from '../db/models';
import { modelContentOf } from './model-hash';

/** The checker's model as the API gives it: the same parts as a revision's own content. */
export async function toModelDto(m: IndependentModel, checkerName: string): Promise<IndependentModelDto> {
  const { input, result, checklist } = await modelContentOf(m);
  const validated = validateCalcInput(input);
  return {
    id: m.id,
    revisionId: m.revisionId,
    checker: { id: m.checkerId, name: checkerName },
    state: m.lockedAt ? 'locked' : 'open',
    input,
    result,
    checklist,
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
