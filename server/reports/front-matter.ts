import { CAUTION, formatNumber } from '../../shared/engine';
import type { ReportData } from './report-data';
import { BOLD, CONTENT_WIDTH, COPPER, INK, PAGE, SANS } from './report-doc';
import type { StateMark } from './page-furniture';

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
      `Revision ${d.revision.label} is ${d.revision.status.replace('_', ' ')}. ` +
        'Only an approved revision, verified against the record hash, may be used to make or release parts.',
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
