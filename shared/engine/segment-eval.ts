import { bendingAt } from './beam/bending-at';
import { enduranceOut } from './endurance';
import { fatigueSafety } from './fatigue-criteria';
import type { Model, Seg } from './model';
import type { Endurance, SegmentResult } from './result';
import type { Piece } from './torque-diagram';
import { FatigueTracker, StaticTracker } from './trackers';

const DEG = 180 / Math.PI;

interface Scan {
  stat: StaticTracker;
  fat: FatigueTracker | null;
}

// One candidate point: nominal stresses of the plain section from M(x) and the piece's torque.
function considerPoint(model: Model, seg: Seg, se: Endurance | null, scan: Scan, x: number, p: Piece): void {
  const { Ma, Mm } = bendingAt(model, x);
  const sa = Ma / seg.Z;
  const sm = Mm / seg.Z;
  const ta = p.Ta / seg.Zp;
  const tm = Math.abs(p.T) / seg.Zp;
  scan.stat.consider(x, sa + sm, ta + tm, Ma, Mm);
  if (scan.fat && se) {
    scan.fat.consider(
      x,
      fatigueSafety(Math.sqrt(sa * sa + 3 * ta * ta), Math.sqrt(sm * sm + 3 * tm * tm), se.Se, seg.mat.Su, seg.mat.Sy),
    );
  }
}

/*
 * Stresses on the plain section of a segment (no stress concentration: features carry that).
 * Torque is constant on a piece and the moment linear between entries, and every criterion is a
 * convex function of them, so the worst point is at a piece end or a bending station: only those
 * are scanned.
 */
function scanSegment(model: Model, seg: Seg, pieces: readonly Piece[], se: Endurance | null): Scan {
  const scan: Scan = { stat: new StaticTracker(), fat: se ? new FatigueTracker() : null };
  for (const p of pieces) {
    if (p.segment !== seg.index) continue;
    considerPoint(model, seg, se, scan, p.start, p);
    for (const at of model.bendingStations ?? [])
      if (at > p.start && at < p.end) considerPoint(model, seg, se, scan, at, p);
    considerPoint(model, seg, se, scan, p.end, p);
  }
  return scan;
}

/** Results of one segment in the calc's units; `se` is its endurance limit in MPa, or null. */
export function evaluateSegment(
  model: Model,
  seg: Seg,
  pieces: readonly Piece[],
  se: Endurance | null,
  hasKeyseat: boolean,
): SegmentResult {
  const k = model.k;
  let T = 0;
  let tauMaxAt = seg.start;
  let twist = 0;
  for (const p of pieces) {
    if (p.segment !== seg.index) continue;
    twist += p.rate * (p.end - p.start);
    if (Math.abs(p.T) > Math.abs(T)) [T, tauMaxAt] = [p.T, p.start];
  }
  const tauMax = (Math.abs(T) * seg.od) / 2 / seg.J;
  const { stat, fat } = scanSegment(model, seg, pieces, se);
  const label = model.input.segments[seg.index].label;
  return {
    index: seg.index,
    label,
    start: seg.start / k.length,
    end: seg.end / k.length,
    length: seg.length / k.length,
    od: seg.od / k.length,
    id: seg.id / k.length,
    isHollow: seg.id > 0,
    material: seg.mat.name,
    G: seg.mat.G / k.modulus,
    Sy: seg.mat.Sy / k.stress,
    Su: seg.mat.Su / k.stress,
    J: seg.J / k.J,
    Zp: seg.Zp / k.Zp,
    T: T / k.torque,
    tauMax: tauMax / k.stress,
    tauMaxAt: tauMaxAt / k.length,
    tauInner: (Math.abs(T) * seg.id) / 2 / seg.J / k.stress,
    gamma: tauMax / seg.mat.G,
    twist: twist * DEG,
    twistPerLength: Math.abs(T) / (seg.mat.G * seg.J) / k.twistPerLength,
    hasKeyseat,
    governingAt: stat.at / k.length,
    Ma: stat.Ma / k.torque,
    Mm: stat.Mm / k.torque,
    sigmaVonMises: stat.sigmaVonMises / k.stress,
    tauTresca: stat.tauTresca / k.stress,
    yieldSafety: stat.yieldSafety(seg.mat.Sy),
    yieldSafetyTresca: stat.yieldSafetyTresca(seg.mat.Sy),
    endurance: se ? enduranceOut(se, k.stress) : null,
    fatigueSafety: fat ? fat.safety : null,
    fatigueAt: fat
      ? {
          goodman: fat.at.goodman / k.length,
          asmeElliptic: fat.at.asmeElliptic / k.length,
          gerber: fat.at.gerber / k.length,
          soderberg: fat.at.soderberg / k.length,
        }
      : null,
  };
}
