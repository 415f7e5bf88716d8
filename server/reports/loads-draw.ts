import type { ShaftLoads } from '../../shared/plots';
import { BOLD, INK, INK_SOFT } from './report-doc';

/** Longest force arrow in points; the room drawOutline keeps above and below the shaft for arrows. */
export const ARROW_PT = 24;
export const LOADS_ROOM_PT = ARROW_PT + 10;
const MIN_ARROW_PT = 5;
const APPLIED = '#2f5d86';

export interface OutlineFrame { X: (v: number) => number; Y: (v: number) => number; k: number }

function arrowHead(doc: PDFKit.PDFDocument, x: number, tip: number, up: boolean, colour: string): void {
  const h = up ? 4 : -4;
  doc.polygon([x - 2.2, tip + h], [x, tip], [x + 2.2, tip + h]).fill(colour);
}

/**
 * Bearings and forces over an outline drawn by drawOutline: the same geometry as the editor's plot
 * (shared/plots), arrows in y ending on the shaft (reactions outside their bearing marks) and forces
 * along z as ⊙ or ⊗ on the centre line.
 */
export function drawLoads(doc: PDFKit.PDFDocument, loads: ShaftLoads, f: OutlineFrame): void {
  const markOf = new Map(loads.bearings.map((b) => [b.tag, b]));
  for (const b of loads.bearings) {
    doc.lineWidth(0.5).strokeColor(INK_SOFT);
    for (const m of b.shapes) {
      if (m.kind === 'rect') doc.rect(f.X(m.x), f.Y(m.y + m.height), m.width * f.k, m.height * f.k).fillAndStroke('#ffffff', INK_SOFT);
      if (m.kind === 'line') doc.moveTo(f.X(m.x1), f.Y(m.y1)).lineTo(f.X(m.x2), f.Y(m.y2)).stroke();
    }
  }
  for (const a of loads.arrows) {
    const colour = a.isReaction ? INK : APPLIED;
    const x = f.X(a.at);
    if (a.yShare > 0) {
      const up = a.Fy > 0;
      const square = markOf.get(a.tag)?.shapes.find((s) => s.kind === 'rect');
      const offset = a.isReaction && square?.kind === 'rect' ? square.height * f.k : 0;
      const tip = (up ? f.Y(-a.top) + offset : f.Y(a.top) - offset);
      const len = Math.max(MIN_ARROW_PT, a.yShare * ARROW_PT);
      const tail = up ? tip + len : tip - len;
      doc.moveTo(x, tail).lineTo(x, up ? tip + 3 : tip - 3).lineWidth(1).strokeColor(colour).stroke();
      arrowHead(doc, x, tip, up, colour);
      if (!a.isReaction) doc.font(BOLD).fontSize(6).fillColor(colour).text(a.tag, x - 12, up ? tail + 1 : tail - 8, { width: 24, align: 'center', lineBreak: false });
    }
    if (a.zShare > 0) {
      const y = f.Y(0);
      doc.circle(x, y, 3).lineWidth(0.7).fillAndStroke('#ffffff', colour);
      if (a.Fz > 0) doc.circle(x, y, 0.9).fill(colour);
      else doc.moveTo(x - 2, y - 2).lineTo(x + 2, y + 2).moveTo(x - 2, y + 2).lineTo(x + 2, y - 2).lineWidth(0.6).strokeColor(colour).stroke();
    }
  }
  doc.lineWidth(1).strokeColor(INK);
  for (const b of loads.bearings) {
    const square = b.shapes.find((s) => s.kind === 'rect');
    const h = square?.kind === 'rect' ? square.height * f.k : 0;
    doc.font(BOLD).fontSize(6).fillColor(INK).text(b.tag, f.X(b.at) - 12, f.Y(b.top) - h - 8, { width: 24, align: 'center', lineBreak: false });
  }
}
