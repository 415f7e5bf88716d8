import { CAUTION } from '../../shared/engine';
import type { ReportData } from './report-data';
import { BOLD, CONTENT_WIDTH, INK, INK_SOFT, MONO, PAGE, SANS, ensureSpace, sectionHeading } from './report-doc';
import { drawQr } from './qr';

/** Section: the record hash in full, how to check it, and who printed this copy when. */
export function drawRecord(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Record and verification');
  ensureSpace(doc, 130);
  const y = doc.y;
  const textW = CONTENT_WIDTH - 120;
  if (d.revision.contentHash) drawQr(doc, d.verifyUrl, PAGE.right - 110, y, 110);
  doc
    .font(SANS)
    .fontSize(8)
    .fillColor(INK_SOFT)
    .text(
      'Record hash (SHA-256 over the canonical JSON of inputs, results, checklist, engine and standard)',
      PAGE.left,
      y,
      { width: textW },
    );
  doc
    .font(MONO)
    .fontSize(8)
    .fillColor(INK)
    .text(d.revision.contentHash ?? 'none: the input has errors', { width: textW });
  doc.moveDown(0.6);
  doc
    .font(SANS)
    .fontSize(8.5)
    .fillColor(INK)
    .text(
      `To check a copy, open ${d.verifyUrl || 'the verify page'} (or scan the code) while signed in to Torquetrail: it says whether the hash matches a stored revision, its state and which signatures are valid.`,
      { width: textW },
    );
  doc.moveDown(0.6);
  doc
    .font(SANS)
    .fontSize(8)
    .fillColor(INK_SOFT)
    .text(
      `Printed ${d.generatedAt.toISOString().slice(0, 19).replace('T', ' ')} UTC by ${d.generatedBy} for ${d.organisation}. Engine ${d.result?.engineVersion ?? '—'}; ${d.revision.ruleSet.code} v${d.revision.ruleSet.version}.`,
      { width: textW },
    );
  doc.moveDown(0.6);
  doc.font(BOLD).fontSize(8.5).fillColor(INK).text(CAUTION, { width: textW });
  doc.x = PAGE.left;
  doc.y = Math.max(doc.y, y + 118);
}
