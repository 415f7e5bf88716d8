import { entryTorque } from '../check-loads';
import type { CalcInput } from '../schema';
import { STATION_TOLERANCE } from '../shaft-geometry';
import { BASE_PER_UNIT } from '../units';
import type { LoadInput } from './load-schema';
import { BEAM_BASE } from './beam-units';

const RAD = Math.PI / 180;

// cos and sin of an angle in degrees, exact at multiples of 90° (so a pull "along +z" has no y residue).
function cosSin(deg: number): [number, number] {
  const q = deg / 90;
  if (Number.isInteger(q)) return [[1, 0, -1, 0][((q % 4) + 4) % 4], [0, 1, 0, -1][((q % 4) + 4) % 4]];
  return [Math.cos(deg * RAD), Math.sin(deg * RAD)];
}

/** A load reduced to forces on the shaft axis (N) and couples (N·mm) in the two planes. */
export interface PointLoad {
  index: number;
  kind: 'force' | 'gear' | 'pulley' | 'sprocket' | 'coupling';
  at: number;
  Fy: number;
  Fz: number;
  Fx: number;
  /** Couples on the slope unknowns dv/dx and dw/dx (from an axial gear force acting off the axis). */
  Cy: number;
  Cz: number;
  /** Transmitted torque, N·mm. */
  T: number;
}

export const GEAR_METHOD =
  'Wt = 2T/d tangential; Wr = Wt·tan φn/cos ψ towards the axis; Wa = Wt·tan ψ axial ' +
  '(Shigley 9th Eqs. 13-36, 13-40); Wa acts at the pitch radius, giving a couple Wa·d/2';
export const BELT_METHOD =
  'shaft load = pull factor × net pull 2T/D (pull factor 1.5 V-belt, 1.0 chain; Mott, from memory)';
export const DEFAULT_PULL_FACTOR = { pulley: 1.5, sprocket: 1.0 } as const;

/** The torque an element transmits in the calc's unit: its own T, else the torque entry at its station, else null. */
export function transmittedTorque(input: CalcInput, load: LoadInput): number | null {
  if (!('kind' in load)) return null;
  if (load.T !== undefined) return load.T;
  const total = input.segments.reduce((s, g) => s + g.length, 0);
  const entry = input.torques.find((t) => Math.abs(t.at - load.at) <= STATION_TOLERANCE * total);
  return entry ? entryTorque(entry, input.units) : null;
}

function gearLoad(p: PointLoad, d: number, phiDeg: number, psiDeg: number, thetaDeg: number): void {
  const psi = psiDeg * RAD;
  const [c, s] = cosSin(thetaDeg);
  // Tangential force on the shaft's gear at the mesh point: its moment about +x is the torque T.
  const Wt = (2 * p.T) / d;
  const Wr = (Math.abs(Wt) * Math.tan(phiDeg * RAD)) / Math.cos(psi);
  p.Fy = -Wt * s - Wr * c;
  p.Fz = Wt * c - Wr * s;
  p.Fx = Wt * Math.tan(psi);
  // Moment of the axial force at radius d/2: r·e_r × Fx·e_x = r·Fx·(0, sin θ, −cos θ); as work
  // conjugates of dv/dx (rotation about +z) and dw/dx (rotation about −y) both are −r·Fx·(cos θ, sin θ).
  p.Cy = (-d / 2) * p.Fx * c;
  p.Cz = (-d / 2) * p.Fx * s;
}

/** All loads of a calc in base units (N, N·mm), in input order. */
export function resolveLoads(input: CalcInput): PointLoad[] {
  const k = BASE_PER_UNIT[input.units];
  const F = BEAM_BASE[input.units].force;
  return (input.loads ?? []).map((load, index) => {
    const kind = 'kind' in load ? load.kind : 'force';
    const p: PointLoad = { index, kind, at: load.at * k.length, Fy: 0, Fz: 0, Fx: 0, Cy: 0, Cz: 0, T: 0 };
    if (!('kind' in load)) {
      [p.Fy, p.Fz, p.Fx] = [(load.Fy ?? 0) * F, (load.Fz ?? 0) * F, (load.Fx ?? 0) * F];
      return p;
    }
    p.T = (transmittedTorque(input, load) ?? 0) * k.torque;
    if (load.kind === 'gear') {
      gearLoad(p, load.pitchDiameter * k.length, load.pressureAngle ?? 20, load.helixAngle ?? 0, load.direction ?? 0);
    } else if (load.kind === 'coupling') {
      [p.Fy, p.Fz] = [(load.Fy ?? 0) * F, (load.Fz ?? 0) * F];
    } else {
      const pull =
        (load.pullFactor ?? DEFAULT_PULL_FACTOR[load.kind]) * Math.abs((2 * p.T) / (load.diameter * k.length));
      const [c, s] = cosSin(load.direction ?? 0);
      [p.Fy, p.Fz] = [pull * c, pull * s];
    }
    return p;
  });
}
