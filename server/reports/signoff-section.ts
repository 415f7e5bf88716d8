import { featureTypesOf, findingPlace, formatBytes } from '../../shared/format';
import { STATE_LABELS } from '../../shared/schemas/revision.schema';
import { ATTACHMENT_KIND_LABELS } from '../../shared/schemas/attachment.schema';
import type { ReportData } from './report-data';
import { FAIL, INK_SOFT, PASS, paragraph, sectionHeading } from './report-doc';
import { drawTable, type Cell } from './pdf-table';
import { drawSignedAttachments } from './signed-attachments';

const when = (iso: string | null) => (iso ? `${iso.slice(0, 16).replace('T', ' ')} UTC` : '—');

export function drawFindings(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Findings and answers');
  const findings = d.revision.findings;
  const types = featureTypesOf(d.input);
  const place = (f: (typeof findings)[number]) => findingPlace(f, types);
  if (findings.length === 0) return paragraph(doc, 'No findings were raised on this revision.', { color: INK_SOFT });
  drawTable(
    doc,
    [
      { header: 'No.', share: 0.06 },
      { header: 'Finding', share: 0.32 },
      { header: 'Raised', share: 0.14 },
      { header: 'Answer', share: 0.3 },
      { header: 'Status', share: 0.18 },
    ],
    findings.map((f): Cell[] => [
      // The same number the screen shows (F + the finding's id), so a reader can say "F4" to anyone.
      `F${f.id}`,
      `${place(f) ? `[${place(f)}] ` : ''}${f.text}`,
      `${f.raisedBy.name}\n${when(f.createdAt)}`,
      f.answer ? `${f.answer}\n— ${f.answeredBy?.name ?? ''}, ${when(f.answeredAt)}` : '—',
      {
        text: f.status === 'closed' ? `closed by ${f.closedBy?.name ?? ''}` : f.status,
        color: f.status === 'closed' ? PASS : FAIL,
      },
    ]),
  );
}

/** Signatures with their validity now: a signature over other content is shown as no longer matching. */
export function drawSignatures(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Signatures');
  const sigs = d.revision.signatures;
  if (sigs.length === 0) return paragraph(doc, 'Not signed yet.', { color: INK_SOFT });
  drawTable(
    doc,
    [
      { header: 'Meaning', share: 0.12 },
      { header: 'Printed name', share: 0.2 },
      { header: 'Role', share: 0.1 },
      { header: 'Signed', share: 0.16 },
      { header: 'Over content hash', share: 0.26, mono: true },
      { header: 'Validity now', share: 0.16 },
    ],
    sigs.map((s): Cell[] => [
      s.meaning,
      s.printedName,
      s.role,
      when(s.signedAt),
      s.contentHash,
      s.isValid
        ? { text: 'VALID: matches the record', color: PASS, bold: true }
        : { text: 'NO LONGER MATCHES the content', color: FAIL, bold: true },
    ]),
    { size: 7.5 },
  );
  paragraph(
    doc,
    'Each signature was made with the signer’s password and covers the exact content hash shown, including the attachments listed below; a later change to the content or the attachment set breaks it.',
    { color: INK_SOFT, size: 7.5 },
  );
  drawSignedAttachments(doc, sigs);
}

export function drawHistory(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Revision history');
  drawTable(
    doc,
    [
      { header: 'Rev', share: 0.07 },
      { header: 'State', share: 0.12 },
      { header: 'Reason for change', share: 0.35 },
      { header: 'Author', share: 0.16 },
      { header: 'Standard', share: 0.14 },
      { header: 'Approved', share: 0.16 },
    ],
    d.calc.revisions.map((r): Cell[] => [
      { text: r.label, bold: r.id === d.revision.id },
      STATE_LABELS[r.status],
      r.reasonForChange,
      r.author.name,
      `${r.ruleSet.code} v${r.ruleSet.version}`,
      when(r.approvedAt),
    ]),
  );
}

export function drawAttachments(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Attachments');
  if (d.attachments.length === 0) return paragraph(doc, 'No files are attached to this revision.', { color: INK_SOFT });
  drawTable(
    doc,
    [
      { header: 'Kind', share: 0.15 },
      { header: 'File', share: 0.25 },
      { header: 'Type, size', share: 0.16 },
      { header: 'Added by', share: 0.14 },
      { header: 'SHA-256', share: 0.3, mono: true },
    ],
    d.attachments.map((a): Cell[] => [
      ATTACHMENT_KIND_LABELS[a.kind],
      a.fileName,
      `${a.mediaType}, ${formatBytes(a.sizeBytes)}`,
      a.uploadedBy.name,
      a.sha256,
    ]),
    { size: 7 },
  );
}
