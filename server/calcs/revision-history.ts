import type { AppAbility } from '../../shared/authz/app-ability';
import { Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { jsonDiff } from './content-diff';
import { expandChecklist } from './stored-checklist';
import { blindError, blindRevisionIds } from '../independent/blind-lists';
import { forbiddenCheck } from '../authz/forbidden-check';

export interface RevisionDiffDto {
  from: { id: number; label: string };
  to: { id: number; label: string };
  input: string | null;
  checklist: string | null;
}

/** A unified diff between any two revisions of one calc: the inputs, and the checklist verdicts. */
export async function diffRevisions(
  ability: AppAbility,
  calcId: number,
  fromId: number,
  toId: number,
): Promise<RevisionDiffDto> {
  forbiddenCheck(ability).throwUnlessCan('read', 'Revision');
  const [from, to] = await Promise.all([Revision.findByPk(fromId), Revision.findByPk(toId)]);
  if (!from || from.calcId !== calcId) throw AppError.notFound(`Revision ${fromId} of calc ${calcId}`);
  if (!to || to.calcId !== calcId) throw AppError.notFound(`Revision ${toId} of calc ${calcId}`);
  if (
    (
      await blindRevisionIds(
        ability,
        [from, to].map((r) => ({ revisionId: r.id, ruleSetId: r.ruleSetId, authorId: r.authorId, status: r.status })),
      )
    ).size
  )
    throw blindError();
  const rows = (r: Revision) => {
    // Rows stored long ago may lack a location: read loosely.
    const checklist = expandChecklist(r.checklist) as {
      rows?: { clauseId: string; location?: { label?: string; index?: number }; status: string }[];
    } | null;
    return (checklist?.rows ?? []).map(
      (row) => `${row.clauseId} ${row.location?.label ?? row.location?.index ?? ''}: ${row.status}`,
    );
  };
  return {
    from: { id: from.id, label: from.label },
    to: { id: to.id, label: to.label },
    input: jsonDiff(JSON.parse(from.input), JSON.parse(to.input), `rev ${from.label}`, `rev ${to.label}`),
    checklist: jsonDiff(rows(from), rows(to), `rev ${from.label} checklist`, `rev ${to.label} checklist`),
  };
}
