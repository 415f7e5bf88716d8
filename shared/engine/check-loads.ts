import type { CalcIssue } from './issue-messages';
import { formatNumber as f } from './number-format';
import { torqueFromPower } from './power';
import type { CalcInput, TorqueInput } from './schema';
import { locate, segmentBounds } from './shaft-geometry';
import { UNIT_LABELS, type UnitSystem } from './units';

/** External torques must sum to zero within this share of the largest one (rounding of typed values). */
export const BALANCE_TOLERANCE = 1e-6;

/** The torque of an entry in the calc's torque unit (a power entry gives T = P/ω). */
export function entryTorque(t: TorqueInput, system: UnitSystem): number {
  return 'T' in t ? t.T : torqueFromPower(t.power, t.speed, system);
}

function checkBalance(values: number[], what: string, input: CalcInput, out: CalcIssue[]): void {
  const unit = UNIT_LABELS[input.units].torque;
  let sum = 0;
  let largest = 0;
  let at = 0;
  values.forEach((v, i) => {
    sum += v;
    if (Math.abs(v) > Math.abs(largest)) [largest, at] = [v, input.torques[i].at];
  });
  const tol = BALANCE_TOLERANCE * Math.abs(largest);
  if (Math.abs(sum) <= tol) return;
  out.push({
    path: 'torques',
    message:
      `${what} do not balance: they sum to ${f(sum)} ${unit} (allowed ±${f(tol)} ${unit}); ` +
      `the largest is ${f(largest)} ${unit} at ${f(at)} ${UNIT_LABELS[input.units].length}, ` +
      `so a further ${f(-sum)} ${unit} is needed, or a value is mistyped`,
  });
}

function checkStations(
  items: readonly { at: number }[],
  name: string,
  bounds: number[],
  input: CalcInput,
  out: CalcIssue[],
): void {
  const len = UNIT_LABELS[input.units].length;
  items.forEach((item, i) => {
    if (locate(item.at, bounds).left < 0) {
      out.push({
        path: `${name}[${i}].at`,
        message: `station ${f(item.at)} ${len} is off the shaft (0 to ${f(bounds[bounds.length - 1])} ${len})`,
      });
    }
  });
}

/** Cross-field checks on torques and bending entries: stations on the shaft, torque balance. */
export function checkLoads(input: CalcInput): CalcIssue[] {
  const out: CalcIssue[] = [];
  const bounds = segmentBounds(input.segments.map((s) => s.length));
  checkStations(input.torques, 'torques', bounds, input, out);
  checkStations(input.bending ?? [], 'bending', bounds, input, out);
  checkBalance(
    input.torques.map((t) => entryTorque(t, input.units)),
    'external torques',
    input,
    out,
  );
  const hasTa = input.torques.some((t) => t.Ta !== undefined);
  if (hasTa)
    checkBalance(
      input.torques.map((t) => t.Ta ?? 0),
      'alternating torques (Ta)',
      input,
      out,
    );
  if (hasTa && input.fatigue?.alternatingTorqueFraction !== undefined) {
    out.push({
      path: 'fatigue.alternatingTorqueFraction',
      message: 'give either an alternating torque fraction or Ta on the torque entries, not both',
    });
  }
  const seen = new Set<number>();
  (input.bending ?? []).forEach((b, i) => {
    if (seen.has(b.at)) {
      out.push({
        path: `bending[${i}].at`,
        message: `a second bending entry at station ${f(b.at)} ${UNIT_LABELS[input.units].length}`,
      });
    }
    seen.add(b.at);
  });
  return out;
}
