import { FIELD_NAMES, METHOD_NAMES, type CalcResult } from '../../shared/engine';
import { placeOf, unitText } from '../../shared/format';
import { featureTag } from '../../shared/plots';
import type { ReportData } from './report-data';
import { FAIL, INK, paragraph, sectionHeading, subHeading } from './report-doc';
import { drawTable, type Cell } from './pdf-table';
import { num } from './front-matter';

const unit = (r: CalcResult, key: string) => r.fields[key]?.unit ?? '';

function safety(v: number | null | undefined): Cell {
  return { text: num(v ?? null, 3), color: v != null && v < 1 ? FAIL : INK };
}

function segmentRows(r: CalcResult): Cell[][] {
  return r.segments.map((s) => [
    `${s.index + 1}${s.label ? ` ${s.label}` : ''}`,
    `${num(s.od)} / ${num(s.id)}`,
    num(s.J, 5),
    num(s.T),
    num(s.tauMax),
    num(s.twist),
    num(s.twistPerLength),
    safety(s.yieldSafety),
    safety(s.fatigueSafety?.goodman),
  ]);
}

function featureRows(r: CalcResult): Cell[][] {
  return r.features.map((f) => [
    featureTag(f.type as never, f.index),
    num(f.at),
    `${num(f.Kt, 3)} / ${num(f.Kts, 3)}`,
    `${num(f.q, 3)} / ${num(f.qs, 3)}`,
    `${num(f.Kf, 3)} / ${num(f.Kfs, 3)}`,
    num(f.peak.tauA + f.peak.tauM),
    safety(f.yieldSafety),
    safety(f.fatigueSafety?.goodman),
    `Kt: ${f.method.Kt}${f.method.Kts !== f.method.Kt ? `; Kts: ${f.method.Kts}` : ''}`,
  ]);
}

/** Section: computed values with their units, and the formula or published method behind each column. */
export function drawResults(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Results');
  const r = d.result;
  if (!r)
    return paragraph(
      doc,
      'No results: the input has errors, listed with the revision. Nothing below the inputs may be relied on.',
      { color: FAIL },
    );
  subHeading(doc, 'Per segment (plain section, nominal stresses)');
  drawTable(
    doc,
    [
      { header: 'Segment', share: 0.16 },
      { header: `OD / ID ${unit(r, 'od')}`, share: 0.11, mono: true, align: 'right' },
      { header: `J ${unit(r, 'J')}`, share: 0.11, mono: true, align: 'right' },
      { header: `T ${unit(r, 'T')}`, share: 0.1, mono: true, align: 'right' },
      { header: `τmax ${unit(r, 'tauMax')}`, share: 0.1, mono: true, align: 'right' },
      { header: `φ ${unit(r, 'twist')}`, share: 0.1, mono: true, align: 'right' },
      { header: `dφ/dx ${unit(r, 'twistPerLength')}`, share: 0.11, mono: true, align: 'right' },
      { header: 'n_y', share: 0.1, mono: true, align: 'right' },
      { header: 'n_Goodman', share: 0.11, mono: true, align: 'right' },
    ],
    segmentRows(r),
    { size: 7.5 },
  );
  if (r.features.length) {
    subHeading(doc, 'At features (peak stresses with Kf, Kfs)');
    drawTable(
      doc,
      [
        { header: 'Tag', share: 0.06 },
        { header: `At ${unit(r, 'at')}`, share: 0.07, mono: true, align: 'right' },
        { header: 'Kt / Kts', share: 0.1, mono: true },
        { header: 'q / qs', share: 0.1, mono: true },
        { header: 'Kf / Kfs', share: 0.1, mono: true },
        { header: `peak τ ${unit(r, 'tauA')}`, share: 0.09, mono: true, align: 'right' },
        { header: 'n_y', share: 0.07, mono: true, align: 'right' },
        { header: 'n_G', share: 0.07, mono: true, align: 'right' },
        { header: 'Source of the factors', share: 0.34 },
      ],
      featureRows(r),
      { size: 7.5 },
    );
  }
  subHeading(doc, 'Methods');
  const methods: Cell[][] = Object.entries(r.methods).map(([k, v]) => [METHOD_NAMES[k] ?? k, v]);
  for (const key of ['J', 'tauMax', 'twist', 'Kf', 'Se', 'goodman']) {
    const f = r.fields[key];
    if (f) methods.push([`${FIELD_NAMES[key] ?? key}${unitText(f.unit) ? ` [${f.unit}]` : ''}`, f.formula]);
  }
  drawTable(
    doc,
    [
      { header: 'Quantity', share: 0.2 },
      { header: 'Formula or published method', share: 0.8 },
    ],
    methods,
    { size: 7.5 },
  );
  if (r.warnings.length) {
    subHeading(doc, 'Engine warnings');
    for (const w of r.warnings)
      paragraph(
        doc,
        `• ${placeOf(
          w.path,
          r.features.map((f) => f.type),
        )}: ${w.message}`,
        { color: FAIL },
      );
  }
}
