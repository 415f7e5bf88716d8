import type { SupportKind } from './beam-schema';

/*
 * Results of the shaft-as-a-beam model, in the calc's units: forces N or lbf, moments N·m or
 * lbf·in, deflections mm or in, slopes rad, mass kg or lb. Present (possibly empty) on every
 * result; `deflection` and `criticalSpeed` are null only when the calc has no supports.
 * "y" and "z" name the plane of the loads: My is the bending moment from the y-forces (in the
 * x–y plane), Mz from the z-forces; M = √(My² + Mz²).
 */
export interface SupportResult {
  index: number;
  label: string | undefined;
  kind: SupportKind;
  at: number;
  locating: boolean;
  /** Reaction the bearing exerts on the shaft, along +y and +z; F the resultant radial reaction. */
  Fy: number;
  Fz: number;
  F: number;
  /** Axial reaction (magnitude) taken by this bearing. */
  Fa: number;
  slopeY: number;
  slopeZ: number;
  /** Resultant slope of the shaft at the bearing, rad. */
  slope: number;
  /** Equivalent dynamic load P = X·Fr + Y·Fa (P = Fr without axial load). */
  P: number;
  /** Life exponent p: 3 ball, 10/3 roller (ISO 281); null for a plain bearing. */
  p: number | null;
  C: number | null;
  /** Basic rating life (C/P)^p in 10⁶ revolutions; null without C, for a plain bearing or with no load. */
  L10: number | null;
  /** L10 in hours at the operating speed; null where L10 is null or no speed is known. */
  L10h: number | null;
}

export interface LoadResult {
  index: number;
  label: string | undefined;
  kind: 'force' | 'gear' | 'pulley' | 'sprocket' | 'coupling';
  at: number;
  /** Force on the shaft along +y, +z and +x (axial). */
  Fy: number;
  Fz: number;
  Fx: number;
  /** Torque the element transmits (gear, pulley, sprocket, coupling); 0 for a plain force. */
  T: number;
  y: number;
  z: number;
  /** Resultant transverse deflection at the load. */
  deflection: number;
  slopeY: number;
  slopeZ: number;
  slope: number;
}

export interface MassResult {
  index: number;
  label: string | undefined;
  at: number;
  mass: number;
  deflection: number;
}

/** One point of the shear and moment diagrams; at a jump two points share the station (left, then right). */
export interface BendingPoint {
  at: number;
  Vy: number;
  Vz: number;
  My: number;
  Mz: number;
  M: number;
}

export interface DeflectionPoint {
  at: number;
  y: number;
  z: number;
  deflection: number;
  slopeY: number;
  slopeZ: number;
  slope: number;
}

export interface CriticalSpeed {
  /** First bending critical speed, rpm. */
  rpm: number;
  method: string;
  /** Operating speed used for the ratio, rpm; null when the calc gives none. */
  operatingSpeed: number | null;
  /** Critical speed / operating speed; null without an operating speed. */
  ratio: number | null;
  /** Shaft mass plus attached masses. */
  totalMass: number;
}

export interface BeamResults {
  supports: SupportResult[];
  loads: LoadResult[];
  masses: MassResult[];
  bendingDiagram: BendingPoint[];
  deflectionCurve: DeflectionPoint[];
  deflection: { max: number; at: number } | null;
  criticalSpeed: CriticalSpeed | null;
  /** Operating speed of the calc (the speed entry, else a power entry's), rpm; null when none. */
  speed: number | null;
  /** Model assumptions to show beside the beam results. */
  assumptions: string[];
}
