import { STATE_LABELS } from '../../shared/schemas/revision.schema';
import { WORKFLOW, type RevisionState } from '../../shared/workflow/revision-states';
import { TONE_COLOUR } from './page-furniture';
import type { ReportData } from './report-data';
import { BAND, BOLD, CONTENT_WIDTH, COPPER, FAIL, INK, INK_SOFT, MONO, PAGE, PASS, SANS } from './report-doc';
import { drawQr } from './qr';

const QR_WIDTH = 96;

function field(
  doc: PDFKit.PDFDocument,
  label: string,
  value: string,
  x: number,
  y: number,
  w: number,
  colour = INK,
): void {
  doc
    .font(SANS)
    .fontSize(6.5)
    .fillColor(INK_SOFT)
    .text(label.toUpperCase(), x + 6, y + 5, { width: w - 12, characterSpacing: 0.6, lineBreak: false });
  doc
    .font(BOLD)
    .fontSize(9)
    .fillColor(colour)
    .text(value, x + 6, y + 15, { width: w - 12, height: 24, ellipsis: true });
}

const stateColour = (state: RevisionState): string => TONE_COLOUR[WORKFLOW[state].report.tone];

/** The head of page one: identity of the calc, who signed what, the verdict and the QR to verify it. */
export function drawTitleBlock(doc: PDFKit.PDFDocument, d: ReportData): void {
  const r = d.revision;
  const x = PAGE.left;
  const y = PAGE.top + 4;
  const gridW = CONTENT_WIDTH - QR_WIDTH;
  doc.rect(x, y, CONTENT_WIDTH, 64).fill(BAND);
  doc
    .font(BOLD)
    .fontSize(7)
    .fillColor(COPPER)
    .text('SHAFT CALC RECORD', x + 8, y + 8, { characterSpacing: 1.4, lineBreak: false });
  // The longest calc number the form accepts must still fit one line: the type shrinks before it wraps.
  const heading = `${d.calc.number}  rev ${r.label}`;
  let size = 17;
  while (size > 10 && doc.font(BOLD).fontSize(size).widthOfString(heading) > gridW - 16) size -= 0.5;
  doc
    .font(BOLD)
    .fontSize(size)
    .fillColor(INK)
    .text(heading, x + 8, y + 19 + (17 - size) / 2, { width: gridW - 16, height: size * 1.3, ellipsis: true });
  doc
    .font(SANS)
    .fontSize(9.5)
    .fillColor(INK)
    .text(d.calc.title, x + 8, y + 42, { width: gridW - 16, height: 14, ellipsis: true });
  const state = STATE_LABELS[r.status].toUpperCase();
  doc
    .roundedRect(x + CONTENT_WIDTH - QR_WIDTH + 4, y + 18, QR_WIDTH - 12, 26, 3)
    .lineWidth(1.6)
    .strokeColor(stateColour(r.status))
    .stroke();
  doc
    .font(BOLD)
    .fontSize(10)
    .fillColor(stateColour(r.status))
    .text(state, x + CONTENT_WIDTH - QR_WIDTH + 4, y + 26, { width: QR_WIDTH - 12, align: 'center', lineBreak: false });

  const verdict = r.verdict === 'compliant' ? 'Compliant' : r.verdict ? 'Not compliant' : 'No verdict (input errors)';
  const rows: [string, string, string?][][] = [
    [
      ['Project', d.calc.projectCode],
      ['Part / drawing', d.calc.partRef || '—'],
      ['Design standard', `${r.ruleSet.code} v${r.ruleSet.version}`],
      ['Verdict', verdict, r.verdict === 'compliant' ? PASS : FAIL],
    ],
    [
      ['Author', r.author.name],
      ['Checker', r.checker?.name ?? '—'],
      ['Approver', r.approver?.name ?? '—'],
      ['Units · engine', `${d.result?.units ?? d.input['units'] ?? '—'} · ${d.result?.engineVersion ?? '—'}`],
    ],
  ];
  const cellW = gridW / 4;
  rows.forEach((cells, i) =>
    cells.forEach(([label, value, colour], j) => {
      field(doc, label, value, x + j * cellW, y + 64 + i * 38, cellW, colour);
    }),
  );
  doc.lineWidth(0.5).strokeColor(INK_SOFT);
  for (let j = 1; j < 4; j++)
    doc
      .moveTo(x + j * cellW, y + 64)
      .lineTo(x + j * cellW, y + 140)
      .stroke();
  doc
    .moveTo(x, y + 102)
    .lineTo(x + gridW, y + 102)
    .stroke();
  doc
    .moveTo(x, y + 64)
    .lineTo(x + CONTENT_WIDTH, y + 64)
    .stroke();
  if (r.contentHash) drawQr(doc, d.verifyUrl, x + gridW + 12, y + 66, 72);
  doc.rect(x, y, CONTENT_WIDTH, 160).lineWidth(1.2).strokeColor(INK).stroke();
  doc
    .moveTo(x, y + 140)
    .lineTo(x + CONTENT_WIDTH, y + 140)
    .lineWidth(0.5)
    .strokeColor(INK_SOFT)
    .stroke();
  doc
    .moveTo(x + gridW, y + 64)
    .lineTo(x + gridW, y + 140)
    .stroke();
  doc
    .font(SANS)
    .fontSize(6.5)
    .fillColor(INK_SOFT)
    .text('RECORD HASH', x + 6, y + 147, { characterSpacing: 0.6, lineBreak: false });
  doc
    .font(MONO)
    .fontSize(7.6)
    .fillColor(INK)
    .text(r.contentHash ?? 'none: the input has errors', x + 66, y + 146, { lineBreak: false });
  doc.x = PAGE.left;
  doc.y = y + 170;
}
