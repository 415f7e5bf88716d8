import { fromText, toText } from './number-text';
import {
  BEARING_KINDS,
  FORCE_FIELDS,
  FORCE_KINDS,
  type BearingKind,
  type ForceKind,
  type ForceValue,
  type MassValue,
  type SupportValue,
} from './shaft-form';

type Json = Record<string, unknown>;

const obj = (v: unknown): Json => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Json) : {});
const list = (v: unknown): Json[] => (Array.isArray(v) ? v.map(obj) : []);
const str = (v: unknown): string => (typeof v === 'string' ? v : '');

export interface ShaftValues {
  supports: SupportValue[];
  loads: ForceValue[];
  masses: MassValue[];
  speed: string;
}

/** The whole-shaft parts of a stored input of any completeness; a v1 input gives empty lists. */
export function inputToShaftValues(input: unknown): ShaftValues {
  const i = obj(input);
  return {
    supports: list(i['supports']).map((s) => ({
      label: str(s['label']),
      at: toText(s['at']),
      C: toText(s['C']),
      locating: s['locating'] === true,
      X: toText(s['X']),
      Y: toText(s['Y']),
      kind: BEARING_KINDS.includes(s['kind'] as BearingKind) ? (s['kind'] as BearingKind) : 'deep-groove-ball',
    })),
    loads: list(i['loads']).map((l) => ({
      kind: FORCE_KINDS.includes(l['kind'] as ForceKind) ? (l['kind'] as ForceKind) : 'point',
      label: str(l['label']),
      at: toText(l['at']),
      Fy: toText(l['Fy']),
      Fz: toText(l['Fz']),
      Fx: toText(l['Fx']),
      pitchDiameter: toText(l['pitchDiameter']),
      pressureAngle: toText(l['pressureAngle']),
      helixAngle: toText(l['helixAngle']),
      diameter: toText(l['diameter']),
      pullFactor: toText(l['pullFactor']),
      direction: toText(l['direction']),
      T: toText(l['T']),
    })),
    masses: list(i['masses']).map((m) => ({ label: str(m['label']), at: toText(m['at']), mass: toText(m['mass']) })),
    speed: toText(i['speed']),
  };
}

function numbers(row: object, keys: readonly string[]): Json {
  const out: Json = {};
  const label = str((row as Json)['label']).trim();
  if (label) out['label'] = label;
  for (const k of keys) {
    const v = fromText(str((row as Json)[k]));
    if (v !== undefined) out[k] = v;
  }
  return out;
}

/**
 * The whole-shaft parts of the calc input. Empty lists and a blank speed are left out, so a calc without
 * bearings stays exactly the v1 input it was (same content hash, nothing "changed" on opening).
 */
export function shaftValuesToInput(v: ShaftValues): Json {
  const out: Json = {};
  if (v.supports.length) {
    out['supports'] = v.supports.map((s) => ({
      ...numbers(s, ['at']),
      kind: s.kind,
      ...numbers(s, ['C', 'X', 'Y']),
      ...(s.locating ? { locating: true } : {}),
    }));
  }
  if (v.loads.length) {
    out['loads'] = v.loads.map((l) => ({
      ...(l.kind === 'point' ? {} : { kind: l.kind }),
      ...numbers(l, FORCE_FIELDS[l.kind]),
    }));
  }
  if (v.masses.length) out['masses'] = v.masses.map((m) => numbers(m, ['at', 'mass']));
  const speed = fromText(v.speed);
  if (speed !== undefined) out['speed'] = speed;
  return out;
}
