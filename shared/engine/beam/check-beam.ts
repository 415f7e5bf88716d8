import type { CalcIssue } from '../issue-messages';
import { formatNumber as f } from '../number-format';
import type { CalcInput } from '../schema';
import { locate, segmentBounds, STATION_TOLERANCE } from '../shaft-geometry';
import { UNIT_LABELS } from '../units';
import { beamRanges } from './beam-ranges';
import { transmittedTorque } from './resolve-loads';

/*
 * Cross-field checks of the v2 beam inputs: stations on the shaft, enough distinct supports to hold
 * it, elements that have a torque to transmit, and loads that cannot overflow the solution.
 */
function onShaft(
  items: readonly { at: number }[],
  name: string,
  bounds: number[],
  len: string,
  out: CalcIssue[],
): void {
  items.forEach((item, i) => {
    if (locate(item.at, bounds).left < 0) {
      out.push({
        path: `${name}[${i}].at`,
        message: `station ${f(item.at)} ${len} is off the shaft (0 to ${f(bounds[bounds.length - 1])} ${len})`,
      });
    }
  });
}

function isTransverse(l: NonNullable<CalcInput['loads']>[number]): boolean {
  if (!('kind' in l)) return (l.Fy ?? 0) !== 0 || (l.Fz ?? 0) !== 0;
  return l.kind !== 'coupling' || (l.Fy ?? 0) !== 0 || (l.Fz ?? 0) !== 0;
}

function checkSupports(input: CalcInput, total: number, len: string, out: CalcIssue[]): void {
  const supports = input.supports ?? [];
  const loads = input.loads ?? [];
  if (supports.length === 1) {
    out.push({ path: 'supports', message: 'one bearing cannot hold the shaft: give at least two supports' });
  } else if (supports.length === 0 && loads.some(isTransverse)) {
    out.push({ path: 'supports', message: 'transverse loads need at least two supports (bearings) to be carried' });
  } else if (supports.length === 0 && (input.masses ?? []).length) {
    out.push({
      path: 'supports',
      message: 'attached masses are used for the critical speed, which needs at least two supports',
    });
  }
  const tol = STATION_TOLERANCE * total;
  supports.forEach((s, i) => {
    const j = supports.findIndex((o, k) => k < i && Math.abs(o.at - s.at) <= tol);
    if (j >= 0)
      out.push({
        path: `supports[${i}].at`,
        message: `two supports at the same station ${f(s.at)} ${len} (also supports[${j}])`,
      });
    if (s.kind === 'plain' && s.C !== undefined) {
      out.push({ path: `supports[${i}].C`, message: 'a plain bearing has no rating life: leave C empty' });
    }
  });
}

function checkTorque(input: CalcInput, out: CalcIssue[]): void {
  (input.loads ?? []).forEach((l, i) => {
    if (!('kind' in l) || l.kind === 'coupling') return;
    const T = transmittedTorque(input, l);
    if (T === null || T === 0) {
      out.push({
        path: `loads[${i}].T`,
        message: `this ${l.kind} has no torque to transmit: enter its T or a torque entry at station ${f(l.at)} ${UNIT_LABELS[input.units].length}`,
      });
    }
  });
}

/** Refuses loads so large that deflections would overflow (a rough bound: Σ|F|·L³/(E·I) per length). */
function checkScale(input: CalcInput, total: number, out: CalcIssue[]): void {
  let sum = 0;
  for (const l of input.loads ?? []) {
    const T = 'kind' in l && l.kind !== 'coupling' ? Math.abs(transmittedTorque(input, l) ?? 0) : 0;
    const d = 'kind' in l ? (l.kind === 'gear' ? l.pitchDiameter : l.kind === 'coupling' ? 1 : l.diameter) : 1;
    sum +=
      Math.abs('Fy' in l ? (l.Fy ?? 0) : 0) +
      Math.abs('Fz' in l ? (l.Fz ?? 0) : 0) +
      Math.abs('Fx' in l ? (l.Fx ?? 0) : 0) +
      (10 * T) / d;
  }
  const EI = Math.min(...input.segments.map((s) => (s.material ?? input.material).E * (s.od ** 4 - s.id ** 4)));
  const ratio = (sum * total ** 2) / EI;
  if (!Number.isFinite(ratio) || ratio > 1e15) {
    out.push({
      path: 'loads',
      message: 'the loads are too large for the shaft section: deflections would overflow; check the values and units',
    });
  }
}

export function checkBeam(input: CalcInput): CalcIssue[] {
  const ranges = beamRanges(input);
  if (ranges.length) return ranges;
  const out: CalcIssue[] = [];
  const bounds = segmentBounds(input.segments.map((s) => s.length));
  const total = bounds[bounds.length - 1];
  const len = UNIT_LABELS[input.units].length;
  onShaft(input.supports ?? [], 'supports', bounds, len, out);
  onShaft(input.loads ?? [], 'loads', bounds, len, out);
  onShaft(input.masses ?? [], 'masses', bounds, len, out);
  checkSupports(input, total, len, out);
  checkTorque(input, out);
  if ((input.loads ?? []).length) checkScale(input, total, out);
  return out;
}
