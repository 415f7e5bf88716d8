import { ATTACHMENT_KIND_LABELS } from '../../shared/schemas/attachment.schema';
import type { ChecklistRow } from '../../shared/rules';
import type { ReportData } from './report-data';
import { FAIL, INK, INK_SOFT, PASS, WARN, paragraph, sectionHeading, subHeading } from './report-doc';
import { drawTable, type Cell } from './pdf-table';
import { formatBeside, formatUtilisation, placeOf, unitText } from '../../shared/format';

const STATUS: Record<ChecklistRow['status'], { text: string; color: string }> = {
  pass: { text: 'PASS', color: PASS },
  fail: { text: 'FAIL', color: FAIL },
  'not-applicable': { text: 'n/a', color: INK_SOFT },
  error: { text: 'ERROR', color: FAIL },
};

function featureTypesOf(input: Record<string, unknown>): string[] {
  return Array.isArray(input.features) ? input.features.map((f: { type?: string }) => String(f?.type ?? '')) : [];
}

function row(r: ChecklistRow): Cell[] {
  const status = STATUS[r.status];
  const isAdvisoryFail = r.severity === 'advisory' && r.status === 'fail';
  // Same rules as the screen: enough digits to show the side of the limit, no unit "1".
  const pair = formatBeside(r.actual, r.limit);
  return [
    r.reference,
    r.status === 'fail' || r.status === 'error' ? `${r.clauseTitle} — ${r.message}` : r.clauseTitle,
    r.location.label,
    { text: status.text, color: isAdvisoryFail ? WARN : status.color, bold: true },
    r.severity === 'mandatory' ? 'M' : 'A',
    pair.actual,
    pair.limit,
    unitText(r.unit),
    formatUtilisation(r.utilisation),
  ];
}

/** Section: every clause with its reference, outcome and numbers; the manual items with who ticked them. */
export function drawChecklist(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Checklist against the design standard');
  const c = d.checklist;
  if (!c) return paragraph(doc, 'No checklist: the input has errors.', { color: FAIL });
  const verdict = c.verdict === 'compliant' ? 'COMPLIANT' : 'NOT COMPLIANT';
  paragraph(
    doc,
    `${verdict} against ${c.ruleSet.code} v${c.ruleSet.version} “${c.ruleSet.title}”: ${c.counts.pass} pass, ${c.counts.fail} fail (${c.counts.advisoryFail} of them advisory), ${c.counts.error} error, ${c.counts.notApplicable} not applicable.`,
    { color: c.verdict === 'compliant' ? PASS : FAIL, font: 'TT-Sans-Bold' },
  );
  for (const why of c.verdictReasons) paragraph(doc, `• ${why}`, { color: FAIL });
  for (const issue of c.methodIssues)
    paragraph(doc, `• Method: ${placeOf(issue.path, featureTypesOf(d.input))}: ${issue.message}`, { color: FAIL });
  drawTable(
    doc,
    [
      { header: 'Clause', share: 0.12 },
      { header: 'Requirement', share: 0.27 },
      { header: 'Where', share: 0.19 },
      { header: 'Result', share: 0.07 },
      { header: 'M/A', share: 0.04 },
      { header: 'Actual', share: 0.08, align: 'right', mono: true },
      { header: 'Limit', share: 0.08, align: 'right', mono: true },
      { header: 'Unit', share: 0.08 },
      { header: 'Use', share: 0.07, align: 'right' },
    ],
    c.rows.map(row),
    { size: 7 },
  );
  paragraph(
    doc,
    'M mandatory, A advisory. “Use” is utilisation: actual/limit for an upper limit, limit/actual for a minimum.',
    { color: INK_SOFT, size: 7.5 },
  );
  subHeading(doc, "Checker's manual items");
  const state = d.revision.manualItems;
  drawTable(
    doc,
    [
      { header: 'Item', share: 0.42 },
      { header: 'Needs', share: 0.16 },
      { header: 'Done', share: 0.08 },
      { header: 'By, when, note', share: 0.34 },
    ],
    c.manual.map((m): Cell[] => {
      const s = state[m.id];
      return [
        m.text,
        m.requiresAttachment ? ATTACHMENT_KIND_LABELS[m.requiresAttachment] : '—',
        { text: s?.done ? 'yes' : 'no', color: s?.done ? PASS : FAIL, bold: true },
        s?.by
          ? `${s.by}${s.at ? `, ${s.at.slice(0, 16).replace('T', ' ')} UTC` : ''}${s.note ? ` — ${s.note}` : ''}`
          : '—',
      ];
    }),
  );
  doc.fillColor(INK);
}
