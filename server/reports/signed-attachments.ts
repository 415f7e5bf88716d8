import { ATTACHMENT_KIND_LABELS, type AttachmentKind } from '../../shared/schemas/attachment.schema';
import type { SignatureDto } from '../../shared/schemas/calc-dto';
import { INK_SOFT, paragraph } from './report-doc';
import { drawTable, type Cell } from './pdf-table';

const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB`;

/**
 * Per signature, the attachment set it covered when it was made. A file added later (e.g. the
 * checker's material certificate) appears under the later signature only, so a reader sees who
 * vouched for which evidence.
 */
export function drawSignedAttachments(doc: PDFKit.PDFDocument, sigs: readonly SignatureDto[]): void {
  paragraph(doc, 'Attachments each signature covered (name, kind, size, SHA-256):', { color: INK_SOFT, size: 7.5 });
  drawTable(
    doc,
    [
      { header: 'Signature', share: 0.2 },
      { header: 'File', share: 0.26 },
      { header: 'Kind, size', share: 0.18 },
      { header: 'SHA-256', share: 0.36, mono: true },
    ],
    sigs.flatMap((s): Cell[][] => {
      const who = `${s.meaning}, ${s.printedName}`;
      if (!s.attachments)
        return [
          [who, { text: 'made before attachments were part of what is signed: covers none', color: INK_SOFT }, '', ''],
        ];
      if (s.attachments.length === 0) return [[who, { text: 'no attachments', color: INK_SOFT }, '', '']];
      return s.attachments.map((a, i): Cell[] => [
        i === 0 ? who : '',
        a.name,
        `${ATTACHMENT_KIND_LABELS[a.kind as AttachmentKind] ?? a.kind}, ${kb(a.sizeBytes)}`,
        a.sha256,
      ]);
    }),
    { size: 7 },
  );
}
