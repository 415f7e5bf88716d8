import type { CalcResult, FieldInfo } from './result';
import type { UnitSystem } from './units';

/*
 * A result is stored without `fields` (each result field's unit and formula) and `methods`: they belong to the engine
 * version that produced it, not to the row, and are kept once per version (the server's engine_metadata table). The
 * server expands a stored result for its own use and for API readers; the browser may be sent it as stored and
 * expands it here with the version's metadata, which it reads once.
 */

/** One engine version's unit and formula metadata, as recorded when that version first stored a result. */
export interface EngineMetadata {
  fields: Readonly<Record<UnitSystem, Readonly<Record<string, FieldInfo>>>>;
  methods: Readonly<Record<string, string>>;
}

/** A result as stored: the engine's own, without the version's metadata (older rows may still carry it). */
export type StoredResult = Omit<CalcResult, 'fields' | 'methods'> & Partial<Pick<CalcResult, 'fields' | 'methods'>>;

/** The engine version whose metadata a stored result needs, or null when it carries its own. */
export function metadataNeeded(stored: StoredResult): string | null {
  return stored.fields ? null : stored.engineVersion;
}

/** A stored result as the engine returned it: the version's units and formulas put back (same keys, same order). */
export function expandStoredResult(stored: StoredResult, meta: EngineMetadata): CalcResult {
  if (stored.fields) return stored as CalcResult;
  return { ...stored, fields: meta.fields[stored.units], methods: meta.methods };
}
