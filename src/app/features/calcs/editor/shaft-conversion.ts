// Converting the whole editor value between unit systems, field by field.
import { fromBase, toBase, type Quantity as EngineQuantity, type UnitSystem } from '../../../../../shared/engine/units';
import { BEAM_BASE, type BeamFactors } from '../../../../../shared/engine/beam/beam-units';
import type { EditorValue } from './editor-form';
import { convertedText, fromText, toText } from './number-text';

// The whole-shaft model keeps its own factors (force, load rating, mass, density) beside the engine's quantities.
type Quantity = EngineQuantity | keyof BeamFactors;

function inBase(v: number, q: Quantity, system: UnitSystem): number {
  return q in BEAM_BASE[system]
    ? v * BEAM_BASE[system][q as keyof BeamFactors]
    : toBase(v, q as EngineQuantity, system);
}

function fromBaseOf(v: number, q: Quantity, system: UnitSystem): number {
  return q in BEAM_BASE[system]
    ? v / BEAM_BASE[system][q as keyof BeamFactors]
    : fromBase(v, q as EngineQuantity, system);
}

// The quantity behind each numeric field, so switching units converts values instead of relabelling them.
const MATERIAL: Record<string, Quantity> = {
  E: 'modulus',
  G: 'modulus',
  Sy: 'stress',
  Su: 'stress',
  density: 'density',
};
const SEGMENT: Record<string, Quantity> = { length: 'length', od: 'length', id: 'length' };
const TORQUE: Record<string, Quantity> = { at: 'length', T: 'torque', power: 'power', Ta: 'torque' };
const FEATURE: Record<string, Quantity> = {
  at: 'length',
  r: 'length',
  width: 'length',
  height: 'length',
  length: 'length',
  depth: 'length',
  diameter: 'length',
  keySy: 'stress',
};
const BENDING: Record<string, Quantity> = { at: 'length', Ma: 'torque', Mm: 'torque' };
const SUPPORT: Record<string, Quantity> = { at: 'length', C: 'rating' };
// Angles, pull factors and the speed have no unit system; everything else on a force element converts.
const FORCE: Record<string, Quantity> = {
  at: 'length',
  Fy: 'force',
  Fz: 'force',
  Fx: 'force',
  pitchDiameter: 'length',
  diameter: 'length',
  T: 'torque',
};
const MASS: Record<string, Quantity> = { at: 'length', mass: 'mass' };
const FATIGUE: Record<string, Quantity> = { temperature: 'temperature', SePrime: 'stress' };

function convertText(text: string, q: Quantity, from: UnitSystem, to: UnitSystem): string {
  const v = fromText(text);
  // Text that is not a number is left exactly as typed; the engine keeps pointing at it.
  return typeof v === 'number' ? convertedText(fromBaseOf(inBase(v, q, from), q, to)) : text;
}

function convertFields<T extends object>(
  row: T,
  fields: Record<string, Quantity>,
  from: UnitSystem,
  to: UnitSystem,
): T {
  const out = { ...row } as Record<string, unknown>;
  for (const [k, q] of Object.entries(fields)) {
    if (typeof out[k] === 'string') out[k] = convertText(out[k] as string, q, from, to);
  }
  return out as T;
}

// A per-segment material kept as JSON is converted too, or its strengths would silently change meaning.
function convertMaterialJson(json: string, from: UnitSystem, to: UnitSystem): string {
  if (!json) return json;
  try {
    const m = JSON.parse(json) as Record<string, unknown>;
    for (const [k, q] of Object.entries(MATERIAL)) {
      if (typeof m[k] === 'number') m[k] = Number(convertText(toText(m[k]), q, from, to));
    }
    return JSON.stringify(m);
  } catch {
    return json;
  }
}

/** The same shaft expressed in the other unit system (in ↔ mm, lbf·in ↔ N·m, ksi ↔ MPa, hp ↔ kW, °F ↔ °C). */
export function convertValue(v: EditorValue, to: UnitSystem): EditorValue {
  const from = v.units;
  if (from === to) return v;
  return {
    ...v,
    units: to,
    material: convertFields(v.material, MATERIAL, from, to),
    segments: v.segments.map((s) => ({
      ...convertFields(s, SEGMENT, from, to),
      material: convertMaterialJson(s.material, from, to),
    })),
    torques: v.torques.map((t) => convertFields(t, TORQUE, from, to)),
    features: v.features.map((f) => convertFields(f, FEATURE, from, to)),
    bending: v.bending.map((b) => convertFields(b, BENDING, from, to)),
    supports: v.supports.map((x) => convertFields(x, SUPPORT, from, to)),
    loads: v.loads.map((x) => convertFields(x, FORCE, from, to)),
    masses: v.masses.map((x) => convertFields(x, MASS, from, to)),
    fatigue: convertFields(v.fatigue, FATIGUE, from, to),
  };
}
