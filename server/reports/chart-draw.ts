import { formatNumber } from '../../shared/engine';
import type { Chart } from '../../shared/plots';
import { BOLD, COPPER, INK, INK_SOFT, MONO, RULE, SANS } from './report-doc';

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

const INSET = { left: 46, right: 10, top: 22, bottom: 26 };
// A third series is dotted blue: copper dashes are kept for the limits.
const SERIES_COLOURS = [INK, COPPER, '#2f5d86'];

function scaler(chart: Chart, area: Box) {
  const sx = (v: number) => area.x + ((v - chart.x.min) / (chart.x.max - chart.x.min || 1)) * area.w;
  const sy = (v: number) => area.y + area.h - ((v - chart.y.min) / (chart.y.max - chart.y.min || 1)) * area.h;
  return { sx, sy };
}

function grid(
  doc: PDFKit.PDFDocument,
  chart: Chart,
  area: Box,
  sx: (v: number) => number,
  sy: (v: number) => number,
): void {
  doc.lineWidth(0.3).strokeColor(RULE);
  doc.font(MONO).fontSize(6).fillColor(INK_SOFT);
  for (const t of chart.y.ticks) {
    doc
      .moveTo(area.x, sy(t))
      .lineTo(area.x + area.w, sy(t))
      .stroke();
    doc.text(formatNumber(t, 4), area.x - 44, sy(t) - 3, { width: 40, align: 'right', lineBreak: false });
  }
  for (const t of chart.x.ticks) {
    doc
      .moveTo(sx(t), area.y)
      .lineTo(sx(t), area.y + area.h)
      .stroke();
    doc.text(formatNumber(t, 4), sx(t) - 20, area.y + area.h + 3, { width: 40, align: 'center', lineBreak: false });
  }
  doc.rect(area.x, area.y, area.w, area.h).lineWidth(0.7).strokeColor(INK).stroke();
  if (chart.y.min < 0 && chart.y.max > 0)
    doc
      .moveTo(area.x, sy(0))
      .lineTo(area.x + area.w, sy(0))
      .lineWidth(0.7)
      .strokeColor(INK_SOFT)
      .stroke();
}

/** One diagram from shared/plots drawn into a box: the same geometry the editor shows on screen. */
export function drawChart(doc: PDFKit.PDFDocument, chart: Chart, box: Box): void {
  const area = {
    x: box.x + INSET.left,
    y: box.y + INSET.top,
    w: box.w - INSET.left - INSET.right,
    h: box.h - INSET.top - INSET.bottom,
  };
  const { sx, sy } = scaler(chart, area);
  doc
    .font(BOLD)
    .fontSize(8)
    .fillColor(INK)
    .text(chart.title, box.x, box.y + 2, { width: box.w, lineBreak: false });
  grid(doc, chart, area, sx, sy);
  chart.series.forEach((s, i) => {
    if (s.points.length < 2) return;
    doc.moveTo(sx(s.points[0][0]), sy(s.points[0][1]));
    for (const [px, py] of s.points.slice(1)) doc.lineTo(sx(px), sy(py));
    if (s.style === 'dashed') doc.dash(3, { space: 2 });
    if (s.style === 'dotted') doc.dash(1, { space: 1.6 });
    doc
      .lineWidth(1.2)
      .strokeColor(SERIES_COLOURS[i % SERIES_COLOURS.length])
      .stroke()
      .undash();
  });
  for (const l of chart.limits) {
    doc
      .moveTo(sx(l.x1), sy(l.y))
      .lineTo(sx(l.x2), sy(l.y))
      .dash(5, { space: 3 })
      .lineWidth(0.9)
      .strokeColor(COPPER)
      .stroke()
      .undash();
    doc
      .font(SANS)
      .fontSize(6)
      .fillColor(COPPER)
      .text(l.label, sx(l.x1) + 2, sy(l.y) - 8, { lineBreak: false });
  }
  const legend = chart.series.map((s) => s.label).join('   ·   ');
  doc
    .font(SANS)
    .fontSize(6.5)
    .fillColor(INK_SOFT)
    .text(`${legend}   [${chart.yUnit}]`, box.x + INSET.left, box.y + 12, { width: area.w, lineBreak: false });
  doc.text(`${chart.xLabel} [${chart.xUnit}]`, area.x, box.y + box.h - 9, {
    width: area.w,
    align: 'right',
    lineBreak: false,
  });
}
