import type { Checklist } from '../../../../../shared/rules';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { featureTypesOf, placeOf, rowPath, type FindingAnchor } from '../../../../../shared/format';

/** One choice in "Concerns": a checklist row or a named input; `key` is what the select holds. */
export interface AnchorOption {
  key: string;
  label: string;
  anchor: FindingAnchor;
}

export const WHOLE_CALC: AnchorOption = {
  key: '',
  label: 'The calc as a whole',
  anchor: { clauseRef: null, anchorPath: null },
};

// Input entries a reviewer can point at, in the order the editor shows its panels.
const ENTRY_LISTS = ['segments', 'torques', 'bending', 'features', 'supports', 'loads', 'masses'] as const;
const GROUPS = ['material', 'fatigue'] as const;

/** Checklist rows that apply, once per clause and location, labelled as the table shows them. */
export function rowOptions(checklist: Checklist | null): AnchorOption[] {
  const seen = new Set<string>();
  return (checklist?.rows ?? [])
    .filter((r) => r.status !== 'not-applicable')
    .flatMap((r) => {
      const anchor = { clauseRef: r.clauseId, anchorPath: rowPath(r.location) };
      const key = `row|${r.clauseId}|${anchor.anchorPath ?? ''}`;
      if (seen.has(key)) return [];
      seen.add(key);
      return [{ key, label: `§${r.clauseId} ${r.clauseTitle} — ${r.location.label}`, anchor }];
    });
}

/** The calc's input entries (Segment 2, Torque 1, Feature KS1, Material …) by the editor's names. */
export function inputOptions(revision: Pick<RevisionDto, 'input'>): AnchorOption[] {
  const input = revision.input ?? {};
  const types = featureTypesOf(input);
  const option = (path: string): AnchorOption => ({
    key: `input|${path}`,
    label: placeOf(path, types),
    anchor: { clauseRef: null, anchorPath: path },
  });
  const entries = ENTRY_LISTS.flatMap((list) => {
    const rows = input[list];
    return Array.isArray(rows) ? rows.map((_, i) => option(`${list}[${i}]`)) : [];
  });
  return [...entries, ...GROUPS.filter((g) => input[g] && typeof input[g] === 'object').map(option)];
}
