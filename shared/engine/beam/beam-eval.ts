import type { Model } from '../model';
import type { BeamResults } from './beam-result';
import { solveBeam, type BeamSolution } from './beam-solve';
import { BEAM_BASE, STEEL_DENSITY } from './beam-units';
import { deflectionCurve, nodePoint } from './beam-curve';
import { bendingOut, loadResults, supportResults } from './beam-outputs';
import { CRITICAL_SPEED_METHOD, firstBendingFrequency } from './critical-speed';
import { nodeAt } from './mesh';
import { resolveLoads } from './resolve-loads';
import { CalcInputError } from '../validate';

export const BEAM_ASSUMPTIONS = [
  'rigid simple supports at the bearing centres (no bearing stiffness, no moment restraint)',
  'linear elastic, small deflections; Euler–Bernoulli beam (no shear deformation); loads act at points',
  'rotating shaft under steady transverse loads: bending fully reversed, Ma = M, Mm = 0 (Shigley 9th §7-4)',
  'axial forces go to the locating bearing; their direct stress is not included in the stress checks',
  'gravity and the shaft weight are not loads here; masses count only for the critical speed',
];

export interface BeamState {
  solution: BeamSolution | null;
  results: BeamResults;
}

/** Operating speed: the calc's speed entry, else the first power entry's speed; null when none. */
export function operatingSpeed(model: Model): number | null {
  const input = model.input;
  if (input.speed !== undefined) return input.speed;
  const power = input.torques.find((t) => 'speed' in t);
  return power && 'speed' in power ? power.speed : null;
}

function densities(model: Model): number[] {
  const { input, system } = model;
  return input.segments.map((s, i) => {
    const m = s.material ?? input.material;
    if (m.density === undefined && (m.kind ?? 'steel') !== 'steel') {
      model.warnings.push({
        path: s.material ? `segments[${i}].material.density` : 'material.density',
        message: `no density entered for a ${m.kind} material: the steel default ${STEEL_DENSITY[system]} is used for the critical speed`,
      });
    }
    return (m.density ?? STEEL_DENSITY[system]) * BEAM_BASE[system].density;
  });
}

function empty(speed: number | null): BeamResults {
  return {
    supports: [],
    loads: [],
    masses: [],
    bendingDiagram: [],
    deflectionCurve: [],
    deflection: null,
    criticalSpeed: null,
    speed,
    assumptions: [],
  };
}

/** The beam model of a validated calc: statics, deflection, bearing life and critical speed. */
export function evaluateBeam(model: Model): BeamState {
  const { input, k, system } = model;
  const speed = operatingSpeed(model);
  const supports = input.supports ?? [];
  if (supports.length < 2) return { solution: null, results: empty(speed) };
  const loads = resolveLoads(input);
  const masses = (input.masses ?? []).map((m) => ({ at: m.at * k.length, mass: m.mass * BEAM_BASE[system].mass }));
  const stations = [
    ...loads.map((l) => l.at),
    ...masses.map((m) => m.at),
    ...(input.features ?? []).map((f) => f.at * k.length),
  ];
  const beam = solveBeam(
    model,
    supports.map((s) => s.at * k.length),
    loads,
    stations,
    densities(model),
  );
  const { curve, max, at } = deflectionCurve(beam, k.length);
  if (!Number.isFinite(max) || beam.y.R.some((r) => !Number.isFinite(r)) || beam.z.R.some((r) => !Number.isFinite(r))) {
    throw new CalcInputError([
      { path: 'loads', message: 'the beam solution overflows: the loads are too large for the shaft section' },
    ]);
  }
  if (max * k.length > model.total / 100) {
    model.warnings.push({
      path: 'segments',
      message: 'the largest deflection exceeds 1/100 of the shaft length: the small-deflection model no longer holds',
    });
  }
  const eigen = firstBendingFrequency(beam, masses);
  const rpm = eigen ? (eigen.omega * 60) / (2 * Math.PI) : null;
  const massOut = (input.masses ?? []).map((m, i) => {
    const p = nodePoint(beam, nodeAt(beam.mesh, masses[i].at));
    return { index: i, label: m.label, at: m.at, mass: m.mass, deflection: Math.hypot(p.y, p.z) / k.length };
  });
  return {
    solution: beam,
    results: {
      supports: supportResults(model, beam, speed),
      loads: loadResults(model, beam),
      masses: massOut,
      bendingDiagram: bendingOut(model, beam),
      deflectionCurve: curve,
      deflection: { max, at },
      criticalSpeed:
        rpm === null || !eigen
          ? null
          : {
              rpm,
              method: CRITICAL_SPEED_METHOD,
              operatingSpeed: speed,
              ratio: speed ? rpm / speed : null,
              totalMass: eigen.totalMass / BEAM_BASE[system].mass,
            },
      speed,
      assumptions: BEAM_ASSUMPTIONS,
    },
  };
}
