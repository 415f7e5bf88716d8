import type { BeamSolution } from './beam/beam-solve';
import type { CalcIssue } from './issue-messages';
import { entryTorque } from './check-loads';
import { fatigueSettings, type FatigueSettings } from './fatigue-settings';
import type { CalcInput, MaterialInput } from './schema';
import { sectionProps } from './section';
import { segmentBounds } from './shaft-geometry';
import { BASE_PER_UNIT, type FactorTable, type UnitSystem } from './units';

/*
 * The validated input in the internal base units (mm, N·mm, MPa). Everything downstream works on
 * this, so the unit system matters only here and where results are converted back.
 */
export type MaterialKind = NonNullable<MaterialInput['kind']>;

export interface Mat {
  name: string;
  kind: MaterialKind;
  path: string;
  E: number;
  G: number;
  Sy: number;
  Su: number;
  nu: number | undefined;
}

export interface Seg {
  index: number;
  start: number;
  end: number;
  length: number;
  od: number;
  id: number;
  mat: Mat;
  J: number;
  Zp: number;
  Z: number;
}

export interface ExtTorque {
  index: number;
  at: number;
  T: number;
  Ta: number;
  isFromPower: boolean;
}
export interface MomentEntry {
  at: number;
  Ma: number;
  Mm: number;
}

export interface Model {
  system: UnitSystem;
  k: FactorTable;
  input: CalcInput;
  segs: Seg[];
  bounds: number[];
  total: number;
  torques: ExtTorque[];
  moments: MomentEntry[];
  hasTa: boolean;
  fatigue: FatigueSettings | null;
  warnings: CalcIssue[];
  /** The solved beam model (set by evaluate when the calc has supports), and the stations where bending can peak. */
  beam?: BeamSolution | null;
  bendingStations?: number[];
}

function toMat(m: MaterialInput, path: string, k: FactorTable): Mat {
  return {
    name: m.name ?? 'unnamed material',
    kind: m.kind ?? 'steel',
    path,
    E: m.E * k.modulus,
    G: m.G * k.modulus,
    Sy: m.Sy * k.stress,
    Su: m.Su * k.stress,
    nu: m.nu,
  };
}

/** Builds the internal model from input that has passed validateCalcInput. */
export function buildModel(input: CalcInput): Model {
  const k = BASE_PER_UNIT[input.units];
  const bounds = segmentBounds(input.segments.map((s) => s.length * k.length));
  const shared = toMat(input.material, 'material', k);
  const segs = input.segments.map((s, i): Seg => {
    const od = s.od * k.length;
    const id = s.id * k.length;
    const mat = s.material ? toMat(s.material, `segments[${i}].material`, k) : shared;
    const { J, Zp, Z } = sectionProps(od, id);
    return { index: i, start: bounds[i], end: bounds[i + 1], length: bounds[i + 1] - bounds[i], od, id, mat, J, Zp, Z };
  });
  const torques = input.torques.map((t, i): ExtTorque => ({
    index: i,
    at: t.at * k.length,
    T: entryTorque(t, input.units) * k.torque,
    Ta: (t.Ta ?? 0) * k.torque,
    isFromPower: !('T' in t),
  }));
  const moments = (input.bending ?? []).map((b) => ({
    at: b.at * k.length,
    Ma: b.Ma * k.torque,
    Mm: (b.Mm ?? 0) * k.torque,
  }));
  return {
    system: input.units,
    k,
    input,
    segs,
    bounds,
    total: bounds[bounds.length - 1],
    torques: torques.slice().sort((a, b) => a.at - b.at),
    moments: moments.sort((a, b) => a.at - b.at),
    hasTa: input.torques.some((t) => t.Ta !== undefined),
    fatigue: fatigueSettings(input, k),
    warnings: [],
  };
}
