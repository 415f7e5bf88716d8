import type { CalcResult } from '../result';
import { columns, n } from '../result-table';
import { UNIT_LABELS } from '../units';
import { BEAM_LABELS } from './beam-units';

/* Plain-text tables of the beam model for the command line: bearings, loads, critical speed, assumptions. */
function supportTable(r: CalcResult): string {
  const [u, b] = [UNIT_LABELS[r.units], BEAM_LABELS[r.units]];
  const header = [
    '#',
    'kind',
    `at ${u.length}`,
    `Fy ${b.force}`,
    `Fz ${b.force}`,
    `F ${b.force}`,
    `Fa ${b.force}`,
    'slope rad',
    `P ${b.force}`,
    `C ${b.rating}`,
    'L10 10⁶rev',
    'L10h h',
  ];
  const rows = r.supports.map((s) => [
    String(s.index),
    s.kind,
    n(s.at),
    n(s.Fy),
    n(s.Fz),
    n(s.F),
    n(s.Fa),
    n(s.slope, 3),
    n(s.P),
    n(s.C),
    n(s.L10, 4),
    n(s.L10h, 4),
  ]);
  return columns(header, rows);
}

function loadTable(r: CalcResult): string {
  const [u, b] = [UNIT_LABELS[r.units], BEAM_LABELS[r.units]];
  const header = [
    '#',
    'kind',
    `at ${u.length}`,
    `Fy ${b.force}`,
    `Fz ${b.force}`,
    `Fx ${b.force}`,
    `deflection ${u.length}`,
    'slope rad',
  ];
  const rows = r.loads.map((l) => [
    String(l.index),
    l.kind,
    n(l.at),
    n(l.Fy),
    n(l.Fz),
    n(l.Fx),
    n(l.deflection, 4),
    n(l.slope, 3),
  ]);
  return columns(header, rows);
}

function moments(r: CalcResult): string {
  const u = UNIT_LABELS[r.units];
  const header = [`at ${u.length}`, `My ${u.torque}`, `Mz ${u.torque}`, `M ${u.torque}`];
  return columns(
    header,
    r.bendingDiagram.map((p) => [n(p.at), n(p.My), n(p.Mz), n(p.M)]),
  );
}

export function beamTables(r: CalcResult): string[] {
  if (!r.supports.length) return [];
  const u = UNIT_LABELS[r.units];
  const c = r.criticalSpeed;
  const lines = ['', 'Bearings (reactions on the shaft, rating life ISO 281)', supportTable(r)];
  if (r.loads.length) lines.push('', 'Loads', loadTable(r));
  lines.push('', 'Bending moments (beam model)', moments(r));
  if (r.deflection)
    lines.push('', `largest deflection    ${n(r.deflection.max, 4)} ${u.length} at ${n(r.deflection.at)} ${u.length}`);
  if (c) {
    lines.push(
      `first critical speed  ${n(c.rpm)} rpm${c.ratio === null ? ' (no operating speed given)' : `, ${n(c.ratio, 3)} × the operating speed ${n(c.operatingSpeed)} rpm`}`,
      `  method: ${c.method}`,
    );
  }
  lines.push('Assumptions:', ...r.assumptions.map((a) => `  - ${a}`));
  return lines;
}
