import type { CalcInput } from '../engine';
import { torqueFromPower } from '../engine/power';
import type { ComparisonRow, RowGroup } from './comparison-types';
import { compareRow } from './row-compare';
import { compareEntry, compareList, type Entry } from './entry-compare';
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
  type FieldSpec,
} from './input-fields';

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

/** The entry lists compared after the segments and their materials, in the order their rows are listed. */
const LISTS: {
  group: RowGroup;
  name: string;
  noun: string;
  fields: FieldSpec[];
  of: (i: CalcInput) => unknown[] | undefined;
}[] = [
  { group: 'torque', name: 'torques', noun: 'torque', fields: TORQUE_FIELDS, of: torques },
  { group: 'feature', name: 'features', noun: 'feature', fields: FEATURE_FIELDS, of: (i) => i.features },
  { group: 'bending', name: 'bending', noun: 'bending moment', fields: BENDING_FIELDS, of: (i) => i.bending },
  { group: 'support', name: 'supports', noun: 'bearing', fields: SUPPORT_FIELDS, of: (i) => i.supports },
  { group: 'load', name: 'loads', noun: 'load', fields: LOAD_FIELDS, of: (i) => i.loads },
  { group: 'mass', name: 'masses', noun: 'mass', fields: MASS_FIELDS, of: (i) => i.masses },
];

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
  for (const l of LISTS) compareList(out, l.group, l.name, l.noun, l.fields, list(a, l.of(a)), list(b, l.of(b)), tol);
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
