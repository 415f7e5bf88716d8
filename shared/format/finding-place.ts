import { placeOf } from '../engine/field-places';

/** Where a finding is anchored: a clause (with its row's location, `segments[1]`) or a named input. */
export interface FindingAnchor {
  clauseRef: string | null;
  anchorPath: string | null;
}

/** The feature types of a calc input, so places read "Feature SF2" as the editor tags it. */
export function featureTypesOf(input: unknown): string[] {
  const features = (input as { features?: unknown } | null | undefined)?.features;
  return Array.isArray(features) ? features.map((f) => String((f as { type?: unknown } | null)?.type ?? '')) : [];
}

/** The anchor in the screen's words: "§4.2, Segment 2", "Segment 2, outer ⌀", or null for the calc as a whole. */
export function findingPlace(f: FindingAnchor, featureTypes: readonly string[] = []): string | null {
  if (f.clauseRef) return f.anchorPath ? `§${f.clauseRef}, ${placeOf(f.anchorPath, featureTypes)}` : `§${f.clauseRef}`;
  return f.anchorPath ? placeOf(f.anchorPath, featureTypes) : null;
}

/** The input path of a checklist row's location: `segments[1]`, or null for the whole shaft. */
export function rowPath(location: { scope: string; index: number | null }): string | null {
  return location.index === null || location.scope === 'shaft' ? null : `${location.scope}s[${location.index}]`;
}
