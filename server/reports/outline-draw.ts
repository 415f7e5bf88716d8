import type { ShaftLoads, ShaftOutline } from '../../shared/plots';
import { BAND, BOLD, COPPER, INK, INK_SOFT, MONO } from './report-doc';
import type { Box } from './chart-draw';
import { LOADS_ROOM_PT, PLAN_PT, drawLoads } from './loads-draw';

const TAG_ROW = 10;
/** A short, thick shaft is scaled down so it does not fill the page. */
const MAX_SHAFT_PT = 110;

/**
 * The shaft to scale (one factor on both axes), bores hidden-dashed, features marked and tagged; with
 * `loads`, the bearings and Fy arrows on the side view and a strip below it for Fz. Draws from the top
 * of `box` and returns the height used, so the next figure follows without a gap.
 */
export function drawOutline(
  doc: PDFKit.PDFDocument,
  o: ShaftOutline,
  box: Box,
  unit: string,
  loads: ShaftLoads | null = null,
): number {
  const levels = Math.max(0, ...o.features.map((f) => f.level + 1));
  const arrows = loads ? LOADS_ROOM_PT : 0;
  const k = Math.min((box.w - 20) / (o.length || 1), MAX_SHAFT_PT / (2 * o.maxRadius || 1));
  const x0 = box.x + 10 + (box.w - 20 - o.length * k) / 2;
  const yc = box.y + 14 + levels * TAG_ROW + arrows + o.maxRadius * k;
  const X = (v: number) => x0 + v * k;
  const Y = (v: number) => yc - v * k;
  doc
    .font(BOLD)
    .fontSize(8)
    .fillColor(INK)
    .text(`Shaft outline to scale (${unit})`, box.x, box.y, { lineBreak: false });
  for (const s of o.segments) doc.rect(X(s.x), Y(s.y + s.height), s.width * k, s.height * k).fillAndStroke(BAND, INK);
  doc.lineWidth(0.5);
  for (const b of o.bores)
    doc
      .rect(X(b.x), Y(b.y + b.height), b.width * k, b.height * k)
      .dash(2, { space: 2 })
      .stroke(INK_SOFT)
      .undash();
  doc
    .moveTo(X(0) - 6, yc)
    .lineTo(X(o.length) + 6, yc)
    .dash(8, { space: 2 })
    .lineWidth(0.3)
    .stroke(INK_SOFT)
    .undash();
  for (const f of o.features) {
    doc.lineWidth(0.8).strokeColor(COPPER);
    for (const m of f.shapes) {
      if (m.kind === 'rect') doc.rect(X(m.x), Y(m.y + m.height), m.width * k, m.height * k).stroke();
      if (m.kind === 'circle') doc.circle(X(m.cx), Y(m.cy), Math.max(m.r * k, 1)).stroke();
      if (m.kind === 'line') doc.moveTo(X(m.x1), Y(m.y1)).lineTo(X(m.x2), Y(m.y2)).stroke();
      if (m.kind === 'polyline' && m.points.length) {
        doc.moveTo(X(m.points[0][0]), Y(m.points[0][1]));
        for (const [px, py] of m.points.slice(1)) doc.lineTo(X(px), Y(py));
        doc.stroke();
      }
    }
    const tagY = box.y + 12 + (levels - 1 - f.level) * TAG_ROW;
    doc
      .moveTo(X(f.at), tagY + 8)
      .lineTo(X(f.at), Y(f.top))
      .lineWidth(0.4)
      .strokeColor(COPPER)
      .stroke();
    doc
      .font(BOLD)
      .fontSize(6.5)
      .fillColor(COPPER)
      .text(f.tag, X(f.at) - 15, tagY, { width: 30, align: 'center', lineBreak: false });
  }
  const below = yc + o.maxRadius * k + arrows;
  if (loads) drawLoads(doc, loads, { X, Y, k, planY: below + PLAN_PT / 2, x1: X(0), x2: X(o.length) });
  const ticksY = below + (loads ? PLAN_PT : 0) + 4;
  doc.font(MONO).fontSize(6).fillColor(INK_SOFT);
  for (const t of o.x.ticks.filter((t) => t <= o.length))
    doc.text(String(t), X(t) - 15, ticksY, { width: 30, align: 'center', lineBreak: false });
  return ticksY + 10 - box.y;
}
