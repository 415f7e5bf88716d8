import { beamTables } from './beam/beam-table';
import { formatNumber } from './number-format';
import type { CalcResult, Extreme } from './result';
import { UNIT_LABELS } from './units';

/* Plain-text rendering of a result for the command line: aligned columns, units in the headers. */
export const n = (v: number | null | undefined, digits = 4): string =>
  v === null || v === undefined ? '—' : formatNumber(v, digits);

export function columns(header: string[], rows: string[][]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]): string =>
    cells
      .map((c, i) => c.padStart(widths[i]))
      .join('  ')
      .trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n');
}

function segmentTable(r: CalcResult): string {
  const u = UNIT_LABELS[r.units];
  const header = [
    '#',
    `start ${u.length}`,
    `end ${u.length}`,
    `od ${u.length}`,
    `id ${u.length}`,
    `J ${u.J}`,
    `T ${u.torque}`,
    `tauMax ${u.stress}`,
    'twist deg',
    `${u.twistPerLength}`,
    'n_yield',
    'n_Goodman',
  ];
  const rows = r.segments.map((s) => [
    String(s.index),
    n(s.start),
    n(s.end),
    n(s.od),
    n(s.id),
    n(s.J, 5),
    n(s.T),
    n(s.tauMax),
    n(s.twist),
    n(s.twistPerLength),
    n(s.yieldSafety, 3),
    n(s.fatigueSafety?.goodman, 3),
  ]);
  return columns(header, rows);
}

function featureTable(r: CalcResult): string {
  const u = UNIT_LABELS[r.units];
  const header = [
    '#',
    'type',
    `at ${u.length}`,
    'Kt',
    'Kts',
    'q',
    'qs',
    'Kf',
    'Kfs',
    `peak tau ${u.stress}`,
    'n_yield',
    'n_Goodman',
  ];
  const rows = r.features.map((f) => [
    String(f.index),
    f.type,
    n(f.at),
    n(f.Kt, 3),
    n(f.Kts, 3),
    n(f.q, 3),
    n(f.qs, 3),
    n(f.Kf, 3),
    n(f.Kfs, 3),
    n(f.peak.tauA + f.peak.tauM),
    n(f.yieldSafety, 3),
    n(f.fatigueSafety?.goodman, 3),
  ]);
  const methods = r.features.map((f) => `  [${f.index}] Kt: ${f.method.Kt}\n      Kts: ${f.method.Kts}`);
  return `${columns(header, rows)}\n${methods.join('\n')}`;
}

function where(e: Extreme | null, len: string): string {
  return e ? `${n(e.value, 3)} at ${n(e.at)} ${len} (${e.where} ${e.index})` : '— (no load)';
}

function summary(r: CalcResult): string {
  const u = UNIT_LABELS[r.units];
  const lines = [
    `twist end to end      ${n(r.twistTotal)} deg over ${n(r.length)} ${u.length}`,
    `largest shear stress  ${n(r.maxShear.value)} ${u.stress} in segment ${r.maxShear.segment} (from ${n(r.maxShear.at)} ${u.length})`,
    `lowest yield safety   ${where(r.minYieldSafety, u.length)}`,
  ];
  if (r.minFatigueSafety) {
    const m = r.minFatigueSafety;
    lines.push(
      `lowest fatigue safety DE-Goodman ${where(m.goodman, u.length)}; DE-ASME-elliptic ${where(m.asmeElliptic, u.length)};`,
      `                      DE-Gerber ${where(m.gerber, u.length)}; DE-Soderberg ${where(m.soderberg, u.length)}`,
    );
  }
  return lines.join('\n');
}

/** A readable report of one result; it carries the engineering caution at its head and foot. */
export function formatResultTable(r: CalcResult): string {
  const parts = [
    `Torquetrail shaft calc · engine ${r.engineVersion} · ${r.units} units`,
    `CAUTION: ${r.caution}`,
    '',
    'Segments (plain section, nominal stresses)',
    segmentTable(r),
  ];
  if (r.features.length) parts.push('', 'Features (peak stresses with Kf, Kfs)', featureTable(r));
  parts.push(...beamTables(r));
  parts.push('', 'Whole shaft', summary(r));
  if (r.warnings.length) parts.push('', 'Warnings', ...r.warnings.map((w) => `  - ${w.path}: ${w.message}`));
  parts.push('', `CAUTION: ${r.caution}`);
  return `${parts.join('\n')}\n`;
}
