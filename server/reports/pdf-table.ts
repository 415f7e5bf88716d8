import { BAND, BOLD, CONTENT_WIDTH, INK, INK_SOFT, MONO, PAGE, RULE, SANS } from './report-doc';

export interface Column {
  header: string;
  /** Share of the content width; the shares of a table add up to 1. */
  share: number;
  align?: 'left' | 'right' | 'center';
  mono?: boolean;
}

export type Cell = string | { text: string; color?: string; bold?: boolean };

const PAD = 3;

function cellText(cell: Cell): string {
  return typeof cell === 'string' ? cell : cell.text;
}

function rowHeight(doc: PDFKit.PDFDocument, columns: Column[], cells: Cell[], size: number, isHeader: boolean): number {
  let tallest = 0;
  columns.forEach((col, i) => {
    doc.font(isHeader ? BOLD : col.mono ? MONO : SANS).fontSize(size);
    tallest = Math.max(
      tallest,
      doc.heightOfString(cellText(cells[i] ?? '') || ' ', { width: col.share * CONTENT_WIDTH - 2 * PAD }),
    );
  });
  return tallest + 2 * PAD;
}

function drawRow(
  doc: PDFKit.PDFDocument,
  columns: Column[],
  cells: Cell[],
  y: number,
  h: number,
  size: number,
  isHeader: boolean,
): void {
  let x = PAGE.left;
  columns.forEach((col, i) => {
    const cell = cells[i] ?? '';
    const isBold = isHeader || (typeof cell !== 'string' && cell.bold);
    doc
      .font(isBold ? BOLD : col.mono ? MONO : SANS)
      .fontSize(size)
      .fillColor(isHeader ? INK_SOFT : (typeof cell !== 'string' && cell.color) || INK)
      .text(cellText(cell), x + PAD, y + PAD, {
        width: col.share * CONTENT_WIDTH - 2 * PAD,
        align: col.align ?? 'left',
      });
    x += col.share * CONTENT_WIDTH;
  });
  doc
    .moveTo(PAGE.left, y + h)
    .lineTo(PAGE.right, y + h)
    .lineWidth(isHeader ? 0.9 : 0.4)
    .strokeColor(isHeader ? INK : RULE)
    .stroke();
}

/**
 * A plain ruled table that breaks across pages and repeats its header row on each new page.
 * Rows are measured before drawing, so a long cell never runs into the footer.
 */
export function drawTable(
  doc: PDFKit.PDFDocument,
  columns: Column[],
  rows: Cell[][],
  options: { size?: number } = {},
): void {
  const size = options.size ?? 8;
  const header = columns.map((c) => c.header);
  const headerHeight = rowHeight(doc, columns, header, size, true);
  // Drawing text moves doc.y; each row restores it from where the row started.
  const drawHeader = () => {
    const y = doc.y;
    drawRow(doc, columns, header, y, headerHeight, size, true);
    doc.y = y + headerHeight;
  };
  // The header never stands alone at the foot of a page: it goes over with its first row.
  const firstRow = rows.length ? rowHeight(doc, columns, rows[0], size, false) : 14;
  if (doc.y + headerHeight + firstRow > PAGE.bottom) doc.addPage();
  drawHeader();
  rows.forEach((cells, index) => {
    const h = rowHeight(doc, columns, cells, size, false);
    if (doc.y + h > PAGE.bottom) {
      doc.addPage();
      drawHeader();
    }
    const y = doc.y;
    if (index % 2 === 1) doc.rect(PAGE.left, y, CONTENT_WIDTH, h).fill(BAND);
    drawRow(doc, columns, cells, y, h, size, false);
    doc.y = y + h;
  });
  doc.x = PAGE.left;
  doc.y += 4;
  doc.font(SANS).fontSize(9).fillColor(INK);
}
