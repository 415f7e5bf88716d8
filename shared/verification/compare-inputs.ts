import type { CalcInput, UnitSystem } from '../engine';
import { torqueFromPower } from '../engine/power';
import type { CompareValue, ComparisonRow, RowGroup } from './comparison-types';
import { compareRow } from './row-compare';
import {
  BENDING_FIELDS,
  FATIGUE_FIELDS,
  FEATURE_FIELDS,
  LOAD_FIELDS,
  MASS_FIELDS,
  MATERIAL_FIELDS,
  SEGMENT_FIELDS,
  SUPPORT_FIELDS,
  TORQUE_FIELDS,
  inSI,
  unitOf,
  type FieldSpec,
} from './input-fields';

type Entry = Record<string, unknown> | undefined;
interface Side {
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
function compareEntry(
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

function compareList(
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

/** Torque entries compare by the torque they put on the shaft, whether entered as T or as power and speed. */
function torques(input: CalcInput): Entry[] {
  return input.torques.map((t) => ({
    at: t.at,
    Ta: t.Ta,
    T: 'T' in t ? t.T : torqueFromPower(t.power, t.speed, input.units),
  }));
}

/** The material each segment is made of, where either model gives a segment its own. */
function segmentMaterials(out: ComparisonRow[], a: CalcInput, b: CalcInput, tol: number): void {
  const n = Math.min(a.segments.length, b.segments.length);
  for (let i = 0; i < n; i++) {
    if (!a.segments[i].material && !b.segments[i].material) continue;
    compareEntry(
      out,
      'material',
      `segments[${i}].material`,
      `Segment ${i + 1} material`,
      MATERIAL_FIELDS(a.units),
      { units: a.units, entry: a.segments[i].material ?? a.material },
      { units: b.units, entry: b.segments[i].material ?? b.material },
      tol,
    );
  }
}

/**
 * Input by input: material, segments, torques, features, bending, bearings, loads, masses,
 * fatigue data, methods and speed. Labels, titles and notes are free text and not compared.
 */
export function compareInputs(a: CalcInput, b: CalcInput, tol: number): ComparisonRow[] {
  const out: ComparisonRow[] = [];
  const list = (i: CalcInput, l: unknown[] | undefined) => ({ units: i.units, list: (l ?? []) as Entry[] });
  compareEntry(
    out,
    'material',
    'material',
    'Material',
    MATERIAL_FIELDS(a.units),
    { units: a.units, entry: a.material },
    { units: b.units, entry: b.material },
    tol,
  );
  compareList(out, 'segment', 'segments', 'segment', SEGMENT_FIELDS, list(a, a.segments), list(b, b.segments), tol);
  segmentMaterials(out, a, b, tol);
  compareList(out, 'torque', 'torques', 'torque', TORQUE_FIELDS, list(a, torques(a)), list(b, torques(b)), tol);
  compareList(out, 'feature', 'features', 'feature', FEATURE_FIELDS, list(a, a.features), list(b, b.features), tol);
  compareList(out, 'bending', 'bending', 'bending moment', BENDING_FIELDS, list(a, a.bending), list(b, b.bending), tol);
  compareList(out, 'support', 'supports', 'bearing', SUPPORT_FIELDS, list(a, a.supports), list(b, b.supports), tol);
  compareList(out, 'load', 'loads', 'load', LOAD_FIELDS, list(a, a.loads), list(b, b.loads), tol);
  compareList(out, 'mass', 'masses', 'mass', MASS_FIELDS, list(a, a.masses), list(b, b.masses), tol);
  compareEntry(
    out,
    'fatigue',
    'fatigue',
    'Fatigue',
    FATIGUE_FIELDS,
    { units: a.units, entry: a.fatigue },
    { units: b.units, entry: b.fatigue },
    tol,
  );
  const methods = {
    key: 'methods.filletKts',
    section: 'input' as const,
    group: 'methods' as const,
    label: 'Shoulder-fillet Kts method',
    unit: '',
  };
  out.push(compareRow(methods, a.methods?.filletKts ?? 'peterson', b.methods?.filletKts ?? 'peterson', tol));
  if (a.speed !== undefined || b.speed !== undefined) {
    out.push(
      compareRow(
        { key: 'speed', section: 'input', group: 'operation', label: 'Operating speed', unit: 'rpm' },
        a.speed ?? null,
        b.speed ?? null,
        tol,
      ),
    );
  }
  return out;
}
