import type { UnitSystem } from '../engine';
import type { CompareValue, ComparisonRow, RowGroup } from './comparison-types';
import { compareRow } from './row-compare';
import { inSI, unitOf, type FieldSpec } from './input-fields';

/*
 * Two models' input entries compared field by field in SI, so a model in US units and one in SI units compare
 * equal when they describe the same shaft. compare-inputs.ts says which entries are compared.
 */

export type Entry = Record<string, unknown> | undefined;
export interface Side {
  units: UnitSystem;
  entry: Entry;
}

function valueOf(side: Side, spec: FieldSpec): CompareValue {
  const raw = side.entry?.[spec.name] ?? spec.fallback;
  if (typeof raw === 'number') return spec.q === 'text' ? raw : inSI(raw, spec.q, side.units);
  return typeof raw === 'string' || typeof raw === 'boolean' ? raw : null;
}

const upper = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** Compares two entries field by field; an entry only one model has is one row ("entered" / none). */
export function compareEntry(
  out: ComparisonRow[],
  group: RowGroup,
  path: string,
  title: string,
  fields: FieldSpec[],
  a: Side,
  b: Side,
  tol: number,
): void {
  if (!a.entry && !b.entry) return;
  if (!a.entry || !b.entry) {
    out.push(
      compareRow(
        { key: path, section: 'input', group, label: title, unit: '' },
        a.entry ? 'entered' : null,
        b.entry ? 'entered' : null,
        tol,
      ),
    );
    return;
  }
  for (const spec of fields) {
    const av = valueOf(a, spec);
    const bv = valueOf(b, spec);
    if (av === null && bv === null) continue;
    out.push(
      compareRow(
        { key: `${path}.${spec.name}`, section: 'input', group, label: `${title} ${spec.label}`, unit: unitOf(spec.q) },
        av,
        bv,
        tol,
      ),
    );
  }
}

export function compareList(
  out: ComparisonRow[],
  group: RowGroup,
  name: string,
  noun: string,
  fields: FieldSpec[],
  a: { units: UnitSystem; list: Entry[] },
  b: { units: UnitSystem; list: Entry[] },
  tol: number,
): void {
  const n = Math.max(a.list.length, b.list.length);
  for (let i = 0; i < n; i++) {
    compareEntry(
      out,
      group,
      `${name}[${i}]`,
      `${upper(noun)} ${i + 1}`,
      fields,
      { units: a.units, entry: a.list[i] },
      { units: b.units, entry: b.list[i] },
      tol,
    );
  }
}
