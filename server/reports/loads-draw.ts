import type { ShaftLoads } from '../../shared/plots';
import { BOLD, INK, INK_SOFT, MONO } from './report-doc';

/** Longest force arrow in points; the room drawOutline keeps above and below the side view. */
export const ARROW_PT = 24;
export const LOADS_ROOM_PT = ARROW_PT + 10;
/** Height of the x–z strip under the side view. */
export const PLAN_PT = 2 * ARROW_PT + 22;
const MIN_ARROW_PT = 5;
const APPLIED = '#2f5d86';

export interface OutlineFrame {
  X: (v: number) => number;
  Y: (v: number) => number;
  k: number;
  planY: number;
  x1: number;
  x2: number;
}

/** An arrow at x whose head ends at `tip`, pointing up the page when `up`, with the force's tag at its tail. */
function arrow(
  doc: PDFKit.PDFDocument,
  x: number,
  tip: number,
  share: number,
  up: boolean,
  colour: string,
  tag: string,
): void {
  const len = Math.max(MIN_ARROW_PT, share * ARROW_PT);
  const tail = up ? tip + len : tip - len;
  doc
    .moveTo(x, tail)
    .lineTo(x, up ? tip + 3 : tip - 3)
    .lineWidth(1)
    .strokeColor(colour)
    .stroke();
  const h = up ? 4 : -4;
  doc.polygon([x - 2.2, tip + h], [x, tip], [x + 2.2, tip + h]).fill(colour);
  if (tag)
    doc
      .font(BOLD)
      .fontSize(6)
      .fillColor(colour)
      .text(tag, x - 12, up ? tail + 1 : tail - 8, { width: 24, align: 'center', lineBreak: false });
}

/**
 * Bearings and forces over an outline drawn by drawOutline, from the same geometry as the editor's
 * plot (shared/plots): Fy arrows on the side view ending on the shaft (reactions outside their
 * bearing marks), and a strip below on the same stations showing the x–z plane with the Fz arrows.
 */
export function drawLoads(doc: PDFKit.PDFDocument, loads: ShaftLoads, f: OutlineFrame): void {
  const squareOf = (tag: string) => {
    const sq = loads.bearings.find((b) => b.tag === tag)?.shapes.find((s) => s.kind === 'rect');
    return sq?.kind === 'rect' ? sq.height * f.k : 0;
  };
  for (const b of loads.bearings) {
    doc.lineWidth(0.5);
    for (const m of b.shapes) {
      if (m.kind === 'rect')
        doc.rect(f.X(m.x), f.Y(m.y + m.height), m.width * f.k, m.height * f.k).fillAndStroke('#ffffff', INK_SOFT);
      if (m.kind === 'line')
        doc.moveTo(f.X(m.x1), f.Y(m.y1)).lineTo(f.X(m.x2), f.Y(m.y2)).strokeColor(INK_SOFT).stroke();
    }
    doc
      .font(BOLD)
      .fontSize(6)
      .fillColor(INK)
      .text(b.tag, f.X(b.at) - 12, f.Y(b.top) - squareOf(b.tag) - 8, { width: 24, align: 'center', lineBreak: false });
    doc
      .rect(f.X(b.at) - 2.5, f.planY - 2.5, 5, 5)
      .lineWidth(0.6)
      .fillAndStroke('#ffffff', INK);
  }
  doc.moveTo(f.x1, f.planY).lineTo(f.x2, f.planY).dash(8, { space: 2 }).lineWidth(0.3).stroke(INK_SOFT).undash();
  doc
    .font(MONO)
    .fontSize(6)
    .fillColor(INK_SOFT)
    .text('x–z plane: Fz, z upwards here', f.x1, f.planY - PLAN_PT / 2 + 2, { lineBreak: false });
  for (const a of loads.arrows) {
    const colour = a.isReaction ? INK : APPLIED;
    const tag = a.isReaction ? '' : a.tag;
    const x = f.X(a.at);
    if (a.yShare > 0) {
      const up = a.Fy > 0;
      const offset = a.isReaction ? squareOf(a.tag) : 0;
      arrow(doc, x, up ? f.Y(-a.top) + offset : f.Y(a.top) - offset, a.yShare, up, colour, tag);
    }
    if (a.zShare > 0) arrow(doc, x, f.planY + (a.Fz > 0 ? 3 : -3), a.zShare, a.Fz > 0, colour, tag);
  }
  doc.lineWidth(1).strokeColor(INK);
}
