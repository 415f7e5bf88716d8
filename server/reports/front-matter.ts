import { CAUTION, formatNumber } from '../../shared/engine';
import { beamUnit, hasBeamModel } from '../../shared/plots';
import type { ReportData } from './report-data';
import { BOLD, CONTENT_WIDTH, COPPER, FAIL, INK, PAGE, PASS, SANS, WARN } from './report-doc';
import { headlineMark, unitText, type HeadlineOutcome } from '../../shared/format';
import type { StateMark } from './page-furniture';
import { drawTable, type Cell } from './pdf-table';

export const num = (v: number | null | undefined, digits = 4): string =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : formatNumber(v, digits);

function boxed(doc: PDFKit.PDFDocument, title: string, text: string, colour: string): void {
  const width = CONTENT_WIDTH - 20;
  doc.font(SANS).fontSize(8.5);
  const h = doc.heightOfString(text, { width }) + 24;
  const y = doc.y;
  doc.rect(PAGE.left, y, CONTENT_WIDTH, h).lineWidth(1).strokeColor(colour).stroke();
  doc.rect(PAGE.left, y, 4, h).fill(colour);
  doc
    .font(BOLD)
    .fontSize(8.5)
    .fillColor(colour)
    .text(title, PAGE.left + 12, y + 6, { width });
  doc
    .font(SANS)
    .fontSize(8.5)
    .fillColor(INK)
    .text(text, PAGE.left + 12, y + 18, { width });
  doc.x = PAGE.left;
  doc.y = y + h + 8;
}

/** The notices every reader must see before any number: the caution, and what state this copy is in. */
export function drawNotices(doc: PDFKit.PDFDocument, d: ReportData, mark: StateMark | null): void {
  if (mark) {
    boxed(
      doc,
      mark.text,
      `Revision ${d.revision.label} is ${d.revision.status.replace('_', ' ')}. Only an approved revision, verified against the record hash, may be used to make or release parts.`,
      mark.colour,
    );
  }
  boxed(
    doc,
    'Caution',
    `${CAUTION} This report records a calculation and its review; it does not certify a design.`,
    COPPER,
  );
}

const MARK: Record<HeadlineOutcome, { text: string; color: string }> = {
  pass: { text: 'meets', color: PASS },
  fail: { text: 'FAILS', color: FAIL },
  'advisory-fail': { text: 'advisory not met', color: WARN },
  unchecked: { text: '', color: INK },
};

/**
 * The few numbers a reviewer looks at first, each with its unit, where it comes from, and the outcome of the clause
 * that judges it.
 */
export function drawKeyResults(doc: PDFKit.PDFDocument, d: ReportData): void {
  const r = d.result;
  if (!r) return;
  const f = (k: string) => r.fields[k] ?? { unit: '', formula: '' };
  const at = (v: { at: number } | null) => (v ? `at ${num(v.at)} ${f('at').unit}` : 'no load');
  const figure = (
    label: string,
    value: number | null,
    fact: string,
    unit: string,
    where: string,
    formula: string,
    sig: number,
  ): Cell[] => {
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
  };
  const rows: Cell[][] = [
    figure(
      'Largest shear stress τmax',
      r.maxShear.value,
      'tauMax',
      f('tauMax').unit,
      `segment ${r.maxShear.segment + 1}, from ${num(r.maxShear.at)} ${f('at').unit}`,
      f('tauMax').formula,
      4,
    ),
    figure(
      'Twist end to end φ',
      r.twistTotal,
      'twistTotal',
      f('twistTotal').unit,
      `over ${num(r.length)} ${f('length').unit}`,
      f('twistTotal').formula,
      4,
    ),
    figure(
      'Lowest yield safety n_y',
      r.minYieldSafety?.value ?? null,
      'yieldSafety',
      '1',
      at(r.minYieldSafety),
      f('yieldSafety').formula,
      3,
    ),
  ];
  const fatigue = r.minFatigueSafety;
  if (fatigue) {
    // Only the rule set's own criterion is judged by its fatigue clauses; the others are for comparison.
    const judged = d.ruleSet.methods.fatigueCriterion ?? 'DE-Goodman';
    const names: [keyof typeof fatigue, string][] = [
      ['goodman', 'DE-Goodman'],
      ['asmeElliptic', 'DE-ASME-elliptic'],
      ['gerber', 'DE-Gerber'],
      ['soderberg', 'DE-Soderberg'],
    ];
    for (const [k, name] of names) {
      rows.push(
        figure(
          `Lowest fatigue safety, ${name}`,
          fatigue[k]?.value ?? null,
          name === judged ? 'fatigueSafety' : '',
          '1',
          at(fatigue[k]),
          f(k).formula,
          3,
        ),
      );
    }
  }
  if (hasBeamModel(r)) {
    const c = r.criticalSpeed;
    const life = r.supports.filter((s) => s.L10h !== null).sort((a, b) => a.L10h! - b.L10h!)[0];
    rows.push([
      'Largest deflection δ',
      num(r.deflection?.max ?? null, 3),
      beamUnit(r, 'deflection'),
      at(r.deflection),
      f('deflection').formula,
    ]);
    if (life)
      rows.push([
        'Shortest bearing life L10h',
        num(life.L10h, 3),
        'h',
        `bearing ${life.index + 1} at ${num(life.at)} ${f('at').unit}`,
        f('L10h').formula,
      ]);
    rows.push([
      'Critical / operating speed',
      num(c?.ratio ?? null, 3),
      '–',
      c ? `first critical ${num(c.rpm)} rpm` : 'not computed',
      c?.method ?? '',
    ]);
  }
  drawTable(
    doc,
    [
      { header: 'Result', share: 0.22 },
      { header: 'Value', share: 0.09, align: 'right', mono: true },
      { header: 'Unit', share: 0.06 },
      { header: 'Against the standard', share: 0.17 },
      { header: 'Where', share: 0.16 },
      { header: 'Method', share: 0.3 },
    ],
    rows,
  );
}
