import { hasBeamModel, beamUnit } from '../../shared/plots';
import { headlineMark, unitText, type HeadlineOutcome } from '../../shared/format';
import type { CalcResult } from '../../shared/engine';
import type { ReportData } from './report-data';
import { FAIL, INK, PASS, WARN } from './report-doc';
import { num } from './front-matter';
import { drawTable, type Cell, type Column } from './pdf-table';

const MARK: Record<HeadlineOutcome, { text: string; color: string }> = {
  pass: { text: 'meets', color: PASS },
  fail: { text: 'FAILS', color: FAIL },
  'advisory-fail': { text: 'advisory not met', color: WARN },
  unchecked: { text: '', color: INK },
};

const COLUMNS: Column[] = [
  { header: 'Result', share: 0.22 },
  { header: 'Value', share: 0.09, align: 'right', mono: true },
  { header: 'Unit', share: 0.06 },
  { header: 'Against the standard', share: 0.17 },
  { header: 'Where', share: 0.16 },
  { header: 'Method', share: 0.3 },
];

const FATIGUE_NAMES: [keyof NonNullable<CalcResult['minFatigueSafety']>, string][] = [
  ['goodman', 'DE-Goodman'],
  ['asmeElliptic', 'DE-ASME-elliptic'],
  ['gerber', 'DE-Gerber'],
  ['soderberg', 'DE-Soderberg'],
];

/** One headline figure: where it sits, the formula behind it, and what the standard's clause makes of it. */
interface Figure {
  label: string;
  value: number | null;
  fact: string;
  unit: string;
  where: string;
  formula: string;
  sig: number;
}

/** The cells of one figure's row, marked by the clause that judges `fact` (none: unchecked). */
function figureRow(d: ReportData, { label, value, fact, unit, where, formula, sig }: Figure): Cell[] {
  const mark = headlineMark(value, fact, d.checklist, d.ruleSet, sig);
  const judged = mark.outcome === 'unchecked' ? '—' : `${MARK[mark.outcome].text} ${mark.limitText}`;
  return [
    label,
    { text: mark.text, color: MARK[mark.outcome].color, bold: mark.outcome === 'fail' },
    unitText(unit),
    { text: judged, color: MARK[mark.outcome].color, bold: mark.outcome !== 'pass' },
    where,
    formula,
  ];
}

type Lookup = (k: string) => { unit: string; formula: string };

function stressFigures(r: CalcResult, f: Lookup, at: (v: { at: number } | null) => string): Figure[] {
  const where = `segment ${r.maxShear.segment + 1}, from ${num(r.maxShear.at)} ${f('at').unit}`;
  const shear = { label: 'Largest shear stress τmax', value: r.maxShear.value, fact: 'tauMax', where, sig: 4 };
  return [
    { ...shear, unit: f('tauMax').unit, formula: f('tauMax').formula },
    {
      label: 'Twist end to end φ',
      value: r.twistTotal,
      fact: 'twistTotal',
      unit: f('twistTotal').unit,
      where: `over ${num(r.length)} ${f('length').unit}`,
      formula: f('twistTotal').formula,
      sig: 4,
    },
    {
      label: 'Lowest yield safety n_y',
      value: r.minYieldSafety?.value ?? null,
      fact: 'yieldSafety',
      unit: '1',
      where: at(r.minYieldSafety),
      formula: f('yieldSafety').formula,
      sig: 3,
    },
  ];
}

function fatigueFigures(d: ReportData, f: Lookup, at: (v: { at: number } | null) => string): Figure[] {
  const fatigue = d.result?.minFatigueSafety;
  if (!fatigue) return [];
  // Only the rule set's own criterion is judged by its fatigue clauses; the others are for comparison.
  const judged = d.ruleSet.methods.fatigueCriterion ?? 'DE-Goodman';
  return FATIGUE_NAMES.map(([k, name]) => ({
    label: `Lowest fatigue safety, ${name}`,
    value: fatigue[k]?.value ?? null,
    fact: name === judged ? 'fatigueSafety' : '',
    unit: '1',
    where: at(fatigue[k]),
    formula: f(k).formula,
    sig: 3,
  }));
}

/**
 * Deflection, bearing life and critical speed, for a calc with a beam model. Each is marked by the clause that judges
 * it, as on the calc page: the shortest life by the bearing-life clause, the speed ratio by the critical-speed clause;
 * the largest deflection anywhere is not what the gear-deflection clause measures, so it stays unjudged here.
 */
function beamFigures(r: CalcResult, f: Lookup, at: (v: { at: number } | null) => string): Figure[] {
  if (!hasBeamModel(r)) return [];
  const c = r.criticalSpeed;
  const life = r.supports.filter((s) => s.L10h !== null).sort((a, b) => a.L10h! - b.L10h!)[0];
  const deflection = {
    label: 'Largest deflection δ',
    value: r.deflection?.max ?? null,
    fact: 'maxDeflection',
    unit: beamUnit(r, 'deflection'),
    where: at(r.deflection),
    formula: f('deflection').formula,
    sig: 3,
  };
  const speed = {
    label: 'Critical / operating speed',
    value: c?.ratio ?? null,
    fact: 'criticalSpeedRatio',
    unit: '1',
    where: c ? `first critical ${num(c.rpm)} rpm` : 'not computed',
    formula: c?.method ?? '',
    sig: 3,
  };
  if (!life) return [deflection, speed];
  const where = `bearing ${life.index + 1} at ${num(life.at)} ${f('at').unit}`;
  const lifeFigure = { label: 'Shortest bearing life L10h', value: life.L10h, fact: 'L10h', unit: 'h', where, sig: 3 };
  return [deflection, { ...lifeFigure, formula: f('L10h').formula }, speed];
}

/**
 * The few numbers a reviewer looks at first, each with its unit, where it comes from, and the outcome of the clause
 * that judges it.
 */
export function drawKeyResults(doc: PDFKit.PDFDocument, d: ReportData): void {
  const r = d.result;
  if (!r) return;
  const f: Lookup = (k) => r.fields[k] ?? { unit: '', formula: '' };
  const at = (v: { at: number } | null) => (v ? `at ${num(v.at)} ${f('at').unit}` : 'no load');
  const figures = [...stressFigures(r, f, at), ...fatigueFigures(d, f, at), ...beamFigures(r, f, at)];
  drawTable(
    doc,
    COLUMNS,
    figures.map((fig) => figureRow(d, fig)),
  );
}
