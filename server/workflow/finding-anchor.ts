import type { Revision } from '../db/models';
import { AppError } from '../errors/app-error';
import { rowPath, type FindingAnchor } from '../../shared/format/finding-place';
import type { ChecklistRow } from '../../shared/rules';
import { expandChecklist } from '../calcs/stored-checklist';

const refuse = (field: 'clauseRef' | 'anchorPath', reason: string, message: string) =>
  new AppError('validation', 400, message, { fieldErrors: { [field]: [reason] } });

function rowsOf(revision: Revision): ChecklistRow[] {
  return (expandChecklist(revision.checklist) as { rows?: ChecklistRow[] } | null)?.rows ?? [];
}

// `segments[1].od` → ['segments', 1, 'od'], walked through the stored input: an anchor names something that exists.
function inputHas(input: unknown, path: string): boolean {
  let at: unknown = input;
  for (const key of path.replace(/\[(\d+)\]/g, '.$1').split('.')) {
    if (at === null || typeof at !== 'object' || !Object.hasOwn(at, key)) return false;
    at = (at as Record<string, unknown>)[key];
  }
  return true;
}

/**
 * A finding's anchor must point at something on this revision: a checklist clause (and, optionally,
 * one row's location) or an input the calc holds. A stale or
 * made-up anchor is refused at the edge, so the screen and the report can always show it in place.
 */
export function checkFindingAnchor(revision: Revision, anchor: FindingAnchor): FindingAnchor {
  const { clauseRef, anchorPath } = anchor;
  if (clauseRef) {
    // A row that does not apply is still a row: "this clause should apply here" is a fair finding.
    const rows = rowsOf(revision).filter((r) => r.clauseId === clauseRef);
    if (!rows.length)
      throw refuse(
        'clauseRef',
        `is not a clause on this revision's checklist`,
        `§${clauseRef} is not a clause on this revision's checklist`,
      );
    // Without a location the finding concerns the clause wherever it is checked.
    if (anchorPath && !rows.some((r) => rowPath(r.location) === anchorPath)) {
      throw refuse(
        'anchorPath',
        `is not a location where §${clauseRef} is checked`,
        `§${clauseRef} is not checked at that location on this revision`,
      );
    }
    return { clauseRef, anchorPath: anchorPath || null };
  }
  if (anchorPath && !inputHas(JSON.parse(revision.input), anchorPath)) {
    throw refuse(
      'anchorPath',
      'names no input of this revision',
      'The finding names an input this revision does not have',
    );
  }
  return { clauseRef: null, anchorPath: anchorPath || null };
}
