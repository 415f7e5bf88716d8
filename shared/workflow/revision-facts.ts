import type { RevisionDto } from '../schemas/calc-dto';
import type { RevisionParties } from './relations';
import type { SigningContext } from './signing-blockers';

interface ChecklistView {
  rows?: { status?: unknown }[];
  manual?: { id: string }[];
}

/** Who has put their hand to the revision, as its DTO says. */
export const partiesOfRevision = (r: RevisionDto): RevisionParties => ({
  authorId: r.author.id,
  checkerId: r.checker?.id ?? null,
  editorIds: r.editorIds,
});

/**
 * The signing context the blockers read, built from the revision as the API sends it, so the
 * client asks the same questions of the same table as the server (which builds it from its rows).
 */
export function signingContextOf(r: RevisionDto, actor: SigningContext['actor']): SigningContext {
  const checklist = (r.checklist ?? null) as ChecklistView | null;
  const findings = r.findings ?? [];
  return {
    actor,
    revision: {
      status: r.status,
      authorId: r.author?.id,
      checkerId: r.checker?.id ?? null,
      hasResult: r.result !== null && r.result !== undefined,
      verdict: r.verdict,
      errorRows: (checklist?.rows ?? []).filter((row) => row?.status === 'error').length,
    },
    editorIds: r.editorIds ?? [],
    openFindings: findings.filter((f) => f.status === 'open').length,
    unresolvedFindings: findings.filter((f) => f.status !== 'closed').length,
    openManualItems: (checklist?.manual ?? []).filter((m) => !r.manualItems?.[m.id]?.done).length,
  };
}
