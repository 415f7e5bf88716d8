import { formatNumber } from '../engine/number-format';
import { fromSI, type UnitSystem } from '../engine/units';
import type { MaterialInput } from '../engine';
import { MATERIAL_LIBRARY } from './library';
import { BASIS_LABELS, type LibraryMaterial, type MaterialProperty, type SourcedValue } from './material-types';

export function findMaterial(id: string): LibraryMaterial | undefined {
  return MATERIAL_LIBRARY.find((m) => m.id === id);
}

/** The library entry a calc's material name refers to, so a saved calc finds its sources again. */
export function matchMaterial(name: string | undefined): LibraryMaterial | undefined {
  const key = (name ?? '').trim().toLowerCase();
  return key ? MATERIAL_LIBRARY.find((m) => m.name.toLowerCase() === key) : undefined;
}

/** A library value in the calc's units: moduli in GPa or Mpsi, strengths in MPa or ksi. */
export function valueIn(entry: LibraryMaterial, property: MaterialProperty, system: UnitSystem): number | null {
  const v = entry[property];
  if (!v) return null;
  if (property === 'nu' || system === 'SI') return v.value;
  return fromSI(v.value, property === 'E' || property === 'G' ? 'modulus' : 'stress', system);
}

function describe(label: string, v: SourcedValue | null): string | null {
  return v ? `${label}: ${v.source}, ${BASIS_LABELS[v.basis]}` : null;
}

/** One line for the engine's `source` field, naming each value's origin and basis. */
export function sourceText(entry: LibraryMaterial): string {
  const parts = [describe('E, G, ν', entry.E), describe('Sy, Su', entry.Sy)];
  if (entry.needsAuthorStrengths) parts.push('Sy, Su: entered by the author (source to be named)');
  return parts.filter((p): p is string => p !== null).join('; ');
}

/**
 * The entry as calc input in the given unit system. Sy and Su are left out where the library holds no
 * sourced value, so the engine asks the author for them instead of computing with invented numbers.
 */
export function toMaterialInput(entry: LibraryMaterial, system: UnitSystem): Partial<MaterialInput> {
  const out: Partial<MaterialInput> = { name: entry.name, kind: entry.kind, source: sourceText(entry) };
  for (const p of ['E', 'G', 'nu', 'Sy', 'Su'] as const) {
    const v = valueIn(entry, p, system);
    if (v !== null) out[p] = Number(formatNumber(v, 7));
  }
  return out;
}
