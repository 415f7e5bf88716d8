import { CAUTION, type CalcResult } from '../../shared/engine';
import { beamUnit, bearingTag, forceCleaner, hasBeamModel, loadName, loadTag } from '../../shared/plots';
import type { ReportData } from './report-data';
import { INK_SOFT, paragraph, sectionHeading, subHeading } from './report-doc';
import { drawTable, type Cell } from './pdf-table';
import { num } from './front-matter';

const unit = beamUnit;

function reactionRows(r: CalcResult): Cell[][] {
  const c = forceCleaner(r);
  return r.supports.map((s) => [
    `${bearingTag(s.index)}${s.label ? ` ${s.label}` : ''}`,
    s.kind,
    num(s.at),
    num(c(s.Fy)),
    num(c(s.Fz)),
    num(s.F),
    num(s.Fa),
    num(s.slope, 3),
    num(s.L10, 3),
    num(s.L10h, 3),
  ]);
}

function loadRows(r: CalcResult): Cell[][] {
  const c = forceCleaner(r);
  return r.loads.map((l) => [
    `${loadTag(l.kind, l.index)}${l.label ? ` ${l.label}` : ''}`,
    loadName(l.kind),
    num(l.at),
    num(c(l.Fy)),
    num(c(l.Fz)),
    num(l.Fx),
    num(l.deflection, 3),
    num(l.slope, 3),
  ]);
}

function criticalSpeedLine(r: CalcResult): string {
  const c = r.criticalSpeed;
  if (!c) return 'First bending critical speed: not computed.';
  const ratio =
    c.ratio === null
      ? 'no operating speed is given, so there is no ratio'
      : `${num(c.ratio, 3)} times the operating speed of ${num(c.operatingSpeed)} rpm`;
  return `First bending critical speed ${num(c.rpm)} rpm (${c.method}), ${ratio}; mass in the model ${num(c.totalMass)} ${unit(r, 'totalMass')}.`;
}

/**
 * Section: what the whole-shaft model gives (reactions, bearing life, deflection and slope at each force,
 * the largest deflection, the critical speed) with the model's assumptions beside the numbers.
 */
export function drawShaftResults(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Bearings, deflection and critical speed');
  const r = d.result;
  if (!r) return paragraph(doc, 'No results: the input has errors.');
  if (!hasBeamModel(r)) {
    return paragraph(
      doc,
      'This calc has no bearings: bending comes only from moments entered by hand, and no reactions, deflection, bearing life or critical speed are computed.',
      { color: INK_SOFT },
    );
  }
  const F = unit(r, 'Fy');
  subHeading(doc, 'Bearing reactions on the shaft and basic rating life');
  drawTable(
    doc,
    [
      { header: 'Bearing', share: 0.12 },
      { header: 'Kind', share: 0.15 },
      { header: `At ${unit(r, 'at')}`, share: 0.07, mono: true, align: 'right' },
      { header: `Fy ${F}`, share: 0.09, mono: true, align: 'right' },
      { header: `Fz ${F}`, share: 0.09, mono: true, align: 'right' },
      { header: `F ${F}`, share: 0.09, mono: true, align: 'right' },
      { header: `Fa ${F}`, share: 0.08, mono: true, align: 'right' },
      { header: `Slope ${unit(r, 'slope')}`, share: 0.1, mono: true, align: 'right' },
      { header: `L10 ${unit(r, 'L10')}`, share: 0.1, mono: true, align: 'right' },
      { header: `L10h ${unit(r, 'L10h')}`, share: 0.11, mono: true, align: 'right' },
    ],
    reactionRows(r),
    { size: 7.5 },
  );
  if (r.loads.length) {
    subHeading(doc, 'Forces as resolved, with deflection and slope at each');
    drawTable(
      doc,
      [
        { header: 'Force', share: 0.14 },
        { header: 'Element', share: 0.13 },
        { header: `At ${unit(r, 'at')}`, share: 0.08, mono: true, align: 'right' },
        { header: `Fy ${F}`, share: 0.11, mono: true, align: 'right' },
        { header: `Fz ${F}`, share: 0.11, mono: true, align: 'right' },
        { header: `Fx ${F}`, share: 0.11, mono: true, align: 'right' },
        { header: `Deflection ${unit(r, 'deflection')}`, share: 0.16, mono: true, align: 'right' },
        { header: `Slope ${unit(r, 'slope')}`, share: 0.16, mono: true, align: 'right' },
      ],
      loadRows(r),
      { size: 7.5 },
    );
  }
  const dmax = r.deflection;
  paragraph(
    doc,
    `Largest deflection ${num(dmax?.max ?? null, 3)} ${unit(r, 'deflection')} at ${num(dmax?.at ?? null)} ${unit(r, 'at')}. ${criticalSpeedLine(r)}`,
  );
  const methods = ['M', 'deflection', 'slope', 'L10h', 'rpm', 'totalMass']
    .filter((k) => r.fields[k])
    .map((k): Cell[] => [`${k} (${r.fields[k].unit})`, r.fields[k].formula]);
  if (methods.length)
    drawTable(
      doc,
      [
        { header: 'Quantity', share: 0.2 },
        { header: 'Formula or published method', share: 0.8 },
      ],
      methods,
      { size: 7.5 },
    );
  subHeading(doc, 'What this model assumes');
  for (const a of r.assumptions ?? [])
    paragraph(doc, `• ${a.charAt(0).toUpperCase()}${a.slice(1)}${a.endsWith('.') ? '' : '.'}`);
  paragraph(doc, CAUTION, { color: INK_SOFT });
}
