import { CAUTION } from '../../shared/engine';
import type { ComparisonRow } from '../../shared/verification';
import type { ReportData } from './report-data';
import { FAIL, INK_SOFT, PASS, paragraph, sectionHeading } from './report-doc';
import { drawTable, type Cell } from './pdf-table';

const show = (v: ComparisonRow['author'], unit: string) =>
  v === null ? 'none' : typeof v === 'number' ? `${+v.toPrecision(5)}${unit ? ` ${unit}` : ''}` : String(v);

/**
 * How the calc was verified: by review, or by the checker's independent model, with the comparison
 * (every difference with both values) and the hashes a signature covers from content format 3 on.
 */
export function drawIndependentModel(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Independent model');
  const v = d.revision.verification;
  if (!v) return paragraph(doc, 'Verification by review.', { color: INK_SOFT });
  paragraph(doc, `${v.need.reason}.`);
  if (v.need.method === 'review' && !v.model) return;
  if (!v.model) return paragraph(doc, 'No independent model has been started for this revision yet.', { color: FAIL });
  if (!v.signed)
    return paragraph(
      doc,
      `${v.model.checker.name} is building the independent model; it is compared with this calc once locked.`,
      { color: INK_SOFT },
    );
  const s = v.signed;
  const differences = s.comparison.rows.filter((r) => !r.agrees);
  const compared = s.comparison.rows.length;
  paragraph(
    doc,
    `Built by ${s.checker} from the source documents without seeing this calc, locked ${s.lockedAt.slice(0, 16).replace('T', ' ')} UTC. ` +
      `${compared} values compared (${s.comparison.inputs.compared} inputs, ${s.comparison.results.compared} results): ` +
      (s.agrees
        ? "the two models agree within the standard's tolerances."
        : `${differences.length === 1 ? '1 difference' : `${differences.length} differences`}, ` +
          'each raised as a finding for the author to answer.'),
    { color: s.agrees ? PASS : undefined },
  );
  paragraph(doc, `Independent model hash ${s.modelHash}; compared with the author's model hash ${s.authorHash}.`, {
    size: 7.5,
    color: INK_SOFT,
  });
  if (differences.length) {
    drawTable(
      doc,
      [
        { header: 'Row', share: 0.34 },
        { header: "Author's model", share: 0.2 },
        { header: 'Independent model', share: 0.2 },
        { header: 'Difference', share: 0.26 },
      ],
      differences.map((r): Cell[] => [
        r.label,
        show(r.author, r.unit),
        show(r.checker, r.unit),
        { text: r.relative === null ? 'not the same' : `${+(r.relative * 100).toPrecision(3)} %`, color: FAIL },
      ]),
      { size: 7.5 },
    );
  }
  paragraph(
    doc,
    `Both models were evaluated by the same engine under the same standard, so they share its model assumptions (listed with the results). ${CAUTION}`,
    { size: 7.5, color: INK_SOFT },
  );
}
