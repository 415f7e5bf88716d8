import type { Model } from '../model';
import type { BendingPoint, LoadResult, SupportResult } from './beam-result';
import type { BeamSolution, DiagramPoint } from './beam-solve';
import { BEAM_BASE } from './beam-units';
import { nodePoint } from './beam-curve';
import { lifeExponent, ratingLife } from './bearing-life';
import { axialReactions } from './axial';
import { nodeAt } from './mesh';

/*
 * The solved beam read out per element, in the calc's own units: what each bearing carries (and its life), what
 * each force deflects, and the shear and bending diagram.
 */

export function supportResults(model: Model, beam: BeamSolution, speed: number | null): SupportResult[] {
  const { system, input } = model;
  const F = BEAM_BASE[system].force;
  const axial = axialReactions(model, beam.loads);
  return (input.supports ?? []).map((s, i) => {
    const p = nodePoint(beam, beam.supportNodes[i]);
    const [Fy, Fz] = [beam.y.R[i], beam.z.R[i]];
    const Fr = Math.hypot(Fy, Fz);
    const C = s.C === undefined ? null : s.C * BEAM_BASE[system].rating;
    const life = ratingLife(s.kind, C, Fr, axial[i], s.X, s.Y, speed);
    return {
      index: i,
      label: s.label,
      kind: s.kind,
      at: s.at,
      locating: s.locating === true,
      Fy: Fy / F,
      Fz: Fz / F,
      F: Fr / F,
      Fa: axial[i] / F,
      slopeY: p.sy,
      slopeZ: p.sz,
      slope: Math.hypot(p.sy, p.sz),
      P: life.P / F,
      p: lifeExponent(s.kind),
      C: s.C ?? null,
      L10: life.L10,
      L10h: life.L10h,
    } satisfies SupportResult;
  });
}

export function loadResults(model: Model, beam: BeamSolution): LoadResult[] {
  const { k, system, input } = model;
  const F = BEAM_BASE[system].force;
  return beam.loads.map((l, i) => {
    const p = nodePoint(beam, nodeAt(beam.mesh, l.at));
    return {
      index: i,
      label: (input.loads ?? [])[i].label,
      kind: l.kind,
      at: l.at / k.length,
      Fy: l.Fy / F,
      Fz: l.Fz / F,
      Fx: l.Fx / F,
      T: l.T / k.torque,
      y: p.y / k.length,
      z: p.z / k.length,
      deflection: Math.hypot(p.y, p.z) / k.length,
      slopeY: p.sy,
      slopeZ: p.sz,
      slope: Math.hypot(p.sy, p.sz),
    };
  });
}

// Rounding leaves residues near 1e-12 of the largest value where the exact value is zero (beyond the last bearing).
function largest(d: readonly DiagramPoint[], a: 'My' | 'Vy', b: 'Mz' | 'Vz'): number {
  let m = 0;
  for (const p of d) m = Math.max(m, Math.abs(p[a]), Math.abs(p[b]));
  return 1e-11 * m;
}

export function bendingOut(model: Model, beam: BeamSolution): BendingPoint[] {
  const { k, system } = model;
  const F = BEAM_BASE[system].force;
  const d = beam.diagram;
  const [tm, tv] = [largest(d, 'My', 'Mz'), largest(d, 'Vy', 'Vz')];
  const clean = (v: number, tol: number): number => (Math.abs(v) <= tol ? 0 : v);
  return d.map((p) => {
    const [My, Mz] = [clean(p.My, tm), clean(p.Mz, tm)];
    return {
      at: p.at / k.length,
      Vy: clean(p.Vy, tv) / F,
      Vz: clean(p.Vz, tv) / F,
      My: My / k.torque,
      Mz: Mz / k.torque,
      M: Math.hypot(My, Mz) / k.torque,
    };
  });
}
