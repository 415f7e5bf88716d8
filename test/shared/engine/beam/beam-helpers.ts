import { evaluateShaft, type CalcResult } from '../../../../shared/engine';

/** E = 200 GPa, solid 50 mm, so EI in N·mm² is known in closed form for the checks. */
export const E = 200_000; // MPa
export const D = 50; // mm
export const I = (Math.PI * D ** 4) / 64; // mm⁴
export const EI = E * I;

export interface BeamCase {
  length: number;
  supports: number[];
  loads: { at: number; Fy?: number; Fz?: number; Fx?: number }[];
  segments?: { length: number; od: number; id?: number }[];
  masses?: { at: number; mass: number }[];
  density?: number;
}

/** A uniform (or stepped) SI shaft on deep-groove ball bearings carrying point forces. */
export function beamInput(c: BeamCase): Record<string, unknown> {
  const segments = (c.segments ?? [{ length: c.length, od: D }]).map((s) => ({
    length: s.length,
    od: s.od,
    id: s.id ?? 0,
  }));
  return {
    units: 'SI',
    material: { E: E / 1000, G: 80, Sy: 400, Su: 600, ...(c.density ? { density: c.density } : {}) },
    segments,
    torques: [],
    supports: c.supports.map((at) => ({ at, kind: 'deep-groove-ball' })),
    loads: c.loads,
    ...(c.masses ? { masses: c.masses } : {}),
  };
}

export function solve(c: BeamCase): CalcResult {
  return evaluateShaft(beamInput(c));
}

/** Deflection (mm, y plane) of the curve at a station, from the result's curve points. */
export function yAt(r: CalcResult, at: number): number {
  const p = r.deflectionCurve.find((q) => Math.abs(q.at - at) < 1e-9);
  if (!p) throw new Error(`no curve point at ${at}`);
  return p.y;
}
