import { toSI, type CalcResult, type UnitSystem } from '../engine';
import { BEAM_BASE } from '../engine/beam/beam-units';
import type { Checklist } from '../rules';
import type { CompareValue, ComparisonRow, RowGroup } from './comparison-types';
import { compareRow } from './row-compare';

/** One model's evaluated record: the engine result and the checklist under the standard. */
export interface ModelRecord {
  result: CalcResult;
  checklist: Checklist;
}

const CRITERIA = [
  ['goodman', 'DE-Goodman'],
  ['asmeElliptic', 'DE-ASME-elliptic'],
  ['gerber', 'DE-Gerber'],
  ['soderberg', 'DE-Soderberg'],
] as const;

const force = (v: number, units: UnitSystem) => (v * BEAM_BASE[units].force) / BEAM_BASE.SI.force;

/**
 * Result by result: largest shear, twist, lowest yield and fatigue safety, bearing reactions,
 * critical speed, the verdict and each clause's outcome (matched by clause and place, so the
 * row labels with their units never matter).
 */
export function compareResults(a: ModelRecord, b: ModelRecord, tol: number): ComparisonRow[] {
  const out: ComparisonRow[] = [];
  const ua = a.result.units;
  const ub = b.result.units;
  const row = (key: string, group: RowGroup, label: string, unit: string, av: CompareValue, bv: CompareValue) =>
    out.push(compareRow({ key: `result.${key}`, section: 'result', group, label, unit }, av, bv, tol));
  row(
    'maxShear',
    'shaft',
    'Largest torsional shear stress',
    'MPa',
    toSI(a.result.maxShear.value, 'stress', ua),
    toSI(b.result.maxShear.value, 'stress', ub),
  );
  row('twistTotal', 'shaft', 'Twist end to end', 'deg', Math.abs(a.result.twistTotal), Math.abs(b.result.twistTotal));
  row(
    'minYieldSafety',
    'shaft',
    'Lowest yield safety factor',
    '',
    a.result.minYieldSafety?.value ?? null,
    b.result.minYieldSafety?.value ?? null,
  );
  for (const [key, name] of CRITERIA) {
    const av = a.result.minFatigueSafety?.[key]?.value ?? null;
    const bv = b.result.minFatigueSafety?.[key]?.value ?? null;
    if (av !== null || bv !== null)
      row(`minFatigueSafety.${key}`, 'shaft', `Lowest fatigue safety factor (${name})`, '', av, bv);
  }
  const n = Math.max(a.result.supports.length, b.result.supports.length);
  for (let i = 0; i < n; i++) {
    const sa = a.result.supports[i];
    const sb = b.result.supports[i];
    row(
      `supports[${i}].F`,
      'reaction',
      `Bearing ${i + 1} radial reaction`,
      'N',
      sa ? force(sa.F, ua) : null,
      sb ? force(sb.F, ub) : null,
    );
    if ((sa?.Fa ?? 0) !== 0 || (sb?.Fa ?? 0) !== 0)
      row(
        `supports[${i}].Fa`,
        'reaction',
        `Bearing ${i + 1} axial reaction`,
        'N',
        sa ? force(sa.Fa, ua) : null,
        sb ? force(sb.Fa, ub) : null,
      );
  }
  if (a.result.criticalSpeed || b.result.criticalSpeed) {
    row(
      'criticalSpeed',
      'shaft',
      'First critical speed',
      'rpm',
      a.result.criticalSpeed?.rpm ?? null,
      b.result.criticalSpeed?.rpm ?? null,
    );
  }
  row('verdict', 'shaft', 'Verdict under the standard', '', a.checklist.verdict, b.checklist.verdict);
  compareClauses(out, a.checklist, b.checklist, tol);
  return out;
}

function clauseKey(r: Checklist['rows'][number]): string {
  return `${r.clauseId}@${r.location.scope}${r.location.index === null ? '' : `[${r.location.index}]`}`;
}

/** Each clause outcome at each place; a place only one model has is a difference too. */
function compareClauses(out: ComparisonRow[], a: Checklist, b: Checklist, tol: number): void {
  const mine = new Map(a.rows.map((r) => [clauseKey(r), r]));
  const theirs = new Map(b.rows.map((r) => [clauseKey(r), r]));
  for (const key of new Set([...mine.keys(), ...theirs.keys()])) {
    const ra = mine.get(key);
    const rb = theirs.get(key);
    const where = (ra ?? rb)!;
    const place = where.location.index === null ? '' : ` at ${where.location.scope} ${where.location.index + 1}`;
    out.push(
      compareRow(
        {
          key: `clause.${key}`,
          section: 'result',
          group: 'clause',
          label: `${where.reference}${place}: ${where.clauseTitle}`,
          unit: '',
        },
        ra?.status ?? null,
        rb?.status ?? null,
        tol,
      ),
    );
  }
}
