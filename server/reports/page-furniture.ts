import { CAUTION } from '../../shared/engine';
import { WORKFLOW, type RevisionState, type Tone } from '../../shared/workflow/revision-states';
import { BOLD, COPPER, FAIL, INK, INK_SOFT, MONO, PAGE, PASS, RULE, SANS, WARN } from './report-doc';

export interface StateMark {
  text: string;
  colour: string;
}

/** The pdf colour of each tone of the workflow table (shared/workflow/revision-states.ts). */
export const TONE_COLOUR: Record<Tone, string> = { pass: PASS, warn: WARN, fail: FAIL };

/**
 * Anything not approved is not for construction. Draft and returned revisions carry the
 * strongest mark; released-then-replaced ones say so, so an old print is not mistaken for current.
 * The words and tone of each state are in the workflow table.
 */
export function stateMark(state: RevisionState): StateMark | null {
  const { mark, tone } = WORKFLOW[state].report;
  return mark ? { text: mark, colour: TONE_COLOUR[tone] } : null;
}

export interface Furniture {
  organisation: string;
  reference: string;
  hash: string | null;
  mark: StateMark | null;
}

function diagonalMark(doc: PDFKit.PDFDocument, mark: StateMark): void {
  doc.save();
  doc.rotate(-35, { origin: [PAGE.width / 2, PAGE.height / 2] });
  doc.font(BOLD).fontSize(34).fillColor(mark.colour).fillOpacity(0.12);
  // The box is wider than the page so the rotated line never wraps; only the page shows.
  doc.text(mark.text, -200, PAGE.height / 2 - 20, { width: PAGE.width + 400, align: 'center', lineBreak: false });
  doc.restore();
  doc.fillOpacity(1);
}

function header(doc: PDFKit.PDFDocument, f: Furniture): void {
  doc
    .font(BOLD)
    .fontSize(8)
    .fillColor(COPPER)
    .text('TORQUETRAIL', PAGE.left, 30, { lineBreak: false, characterSpacing: 1.2 });
  doc.font(SANS).fontSize(8).fillColor(INK_SOFT).text(`  ·  ${f.organisation}`, { lineBreak: false });
  // The reference takes the room left of the brand and organisation, smaller type first, then an ellipsis.
  const left = doc.x - PAGE.left + 16;
  const room = PAGE.right - PAGE.left - left;
  let size = 8;
  while (size > 6 && doc.font(BOLD).fontSize(size).widthOfString(f.reference) > room) size -= 0.5;
  doc
    .font(BOLD)
    .fontSize(size)
    .fillColor(INK)
    .text(f.reference, PAGE.left + left, 30 + (8 - size) / 2, {
      width: room,
      height: size * 1.3,
      align: 'right',
      ellipsis: true,
    });
  doc.moveTo(PAGE.left, 44).lineTo(PAGE.right, 44).lineWidth(0.8).strokeColor(INK).stroke();
  if (f.mark) {
    doc
      .font(BOLD)
      .fontSize(7.5)
      .fillColor(f.mark.colour)
      .text(f.mark.text, PAGE.left, 48, { width: PAGE.right - PAGE.left, align: 'center', lineBreak: false });
  }
}

function footer(doc: PDFKit.PDFDocument, f: Furniture, page: number, pages: number): void {
  const y = PAGE.bottom + 10;
  doc.moveTo(PAGE.left, y).lineTo(PAGE.right, y).lineWidth(0.5).strokeColor(RULE).stroke();
  doc
    .font(SANS)
    .fontSize(7)
    .fillColor(INK_SOFT)
    .text(CAUTION, PAGE.left, y + 5, { width: PAGE.right - PAGE.left - 70, lineBreak: true });
  doc
    .font(BOLD)
    .fontSize(7.5)
    .fillColor(INK)
    .text(`page ${page} of ${pages}`, PAGE.right - 70, y + 5, { width: 70, align: 'right', lineBreak: false });
  const hash = f.hash ? `record hash ${f.hash}` : 'no record hash: the input has errors';
  doc
    .font(MONO)
    .fontSize(6.5)
    .fillColor(INK_SOFT)
    .text(hash, PAGE.left, y + 26, { width: PAGE.right - PAGE.left, lineBreak: false });
}

/** Draws the running header, footer and state mark on every buffered page. */
export function drawFurniture(doc: PDFKit.PDFDocument, f: Furniture): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // Writing in the margins would make pdfkit start a new page; lift the margins while drawing.
    const margins = { ...doc.page.margins };
    doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
    header(doc, f);
    footer(doc, f, i - range.start + 1, range.count);
    if (f.mark) diagonalMark(doc, f.mark);
    doc.page.margins = margins;
  }
}
