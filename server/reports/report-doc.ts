import path from 'node:path';
import fs from 'node:fs';
import PDFDocument from 'pdfkit';

/** A4 in points, with room above and below for the running header and footer. */
export const PAGE = { width: 595.28, height: 841.89, left: 44, right: 551.28, top: 62, bottom: 782 } as const;
export const CONTENT_WIDTH = PAGE.right - PAGE.left;

// The app's own palette (src/styles.scss), on white paper so prints and copies stay legible.
export const INK = '#14343b';
export const INK_SOFT = '#3d5a61';
export const COPPER = '#9a4d10';
export const RULE = '#d9d2c3';
export const BAND = '#edf6f8';
export const PASS = '#1f6b45';
export const FAIL = '#a3261b';
export const WARN = '#8a5a00';

export const SANS = 'TT-Sans';
export const BOLD = 'TT-Sans-Bold';
export const MONO = 'TT-Mono';

const FONT_FILES: Record<string, string> = {
  [SANS]: 'DejaVuSans.ttf',
  [BOLD]: 'DejaVuSans-Bold.ttf',
  [MONO]: 'DejaVuSansMono.ttf',
};

/**
 * A report document with embedded DejaVu fonts: the built-in PDF fonts lack τ, φ, σ, ⁴ and ·,
 * and subsets shipped for the web lack Greek. Pages are buffered so the running header, footer
 * and state mark can be drawn on every page once the page count is known.
 */
export function createReportDoc(
  fontDir: string,
  info: { title: string; subject: string; author: string },
): PDFKit.PDFDocument {
  const doc = new PDFDocument({
    size: 'A4',
    bufferPages: true,
    autoFirstPage: true,
    pdfVersion: '1.7',
    lang: 'en-GB',
    displayTitle: true,
    margins: { top: PAGE.top, bottom: PAGE.height - PAGE.bottom, left: PAGE.left, right: PAGE.width - PAGE.right },
    info: {
      Title: info.title,
      Subject: info.subject,
      Author: info.author,
      Creator: 'Torquetrail',
      Producer: 'Torquetrail',
    },
  });
  for (const [name, file] of Object.entries(FONT_FILES)) {
    const full = path.join(fontDir, file);
    if (!fs.existsSync(full))
      throw new Error(`report font ${full} is missing; install fonts-dejavu-core or set REPORT_FONT_DIR`);
    doc.registerFont(name, full);
  }
  doc.font(SANS).fontSize(9).fillColor(INK);
  return doc;
}

/** Starts a new page when fewer than `height` points are left. */
export function ensureSpace(doc: PDFKit.PDFDocument, height: number): void {
  if (doc.y + height > PAGE.bottom) doc.addPage();
}

// A heading keeps with what follows: room for itself, a line of text, a table header and a couple of rows.
const KEEP_WITH_SECTION = 120;
const KEEP_WITH_SUBHEADING = 95;

export function sectionHeading(doc: PDFKit.PDFDocument, number: number, title: string): void {
  ensureSpace(doc, KEEP_WITH_SECTION);
  doc.moveDown(0.8);
  const y = doc.y;
  doc.rect(PAGE.left, y, 4, 15).fill(COPPER);
  doc
    .font(BOLD)
    .fontSize(11.5)
    .fillColor(INK)
    .text(`${number}  ${title}`, PAGE.left + 11, y + 1, { width: CONTENT_WIDTH - 11 });
  doc
    .moveTo(PAGE.left, doc.y + 3)
    .lineTo(PAGE.right, doc.y + 3)
    .lineWidth(0.6)
    .strokeColor(RULE)
    .stroke();
  doc.x = PAGE.left;
  doc.y += 8;
  doc.font(SANS).fontSize(9).fillColor(INK);
}

export function subHeading(doc: PDFKit.PDFDocument, title: string): void {
  ensureSpace(doc, KEEP_WITH_SUBHEADING);
  doc.moveDown(0.5);
  doc.font(BOLD).fontSize(9.5).fillColor(INK_SOFT).text(title, PAGE.left, doc.y, { width: CONTENT_WIDTH });
  doc.moveDown(0.2);
  doc.font(SANS).fontSize(9).fillColor(INK);
}

export function paragraph(
  doc: PDFKit.PDFDocument,
  text: string,
  options: { color?: string; size?: number; font?: string } = {},
): void {
  doc
    .font(options.font ?? SANS)
    .fontSize(options.size ?? 9)
    .fillColor(options.color ?? INK);
  ensureSpace(doc, doc.heightOfString(text, { width: CONTENT_WIDTH }) + 4);
  doc.text(text, PAGE.left, doc.y, { width: CONTENT_WIDTH });
  doc.font(SANS).fontSize(9).fillColor(INK);
}

/** Collects the finished document into one buffer. */
export function toBuffer(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}
