// The PDF layout: pdfkit, qrcode and every section. Loaded only when a report is rendered (in a worker thread, or
// by ReportService without a pool), so a server or test app that renders no report never loads them (issue 14).
import type { ReportData } from './report-data';
import { createReportDoc, toBuffer } from './report-doc';
import { drawFurniture, stateMark } from './page-furniture';
import { drawTitleBlock } from './title-block';
import { drawNotices } from './front-matter';
import { drawKeyResults } from './key-results';
import { drawInputs } from './inputs-section';
import { drawResults } from './results-section';
import { drawShaftResults } from './shaft-results-section';
import { drawPlots } from './plots-section';
import { drawChecklist } from './checklist-section';
import { drawAttachments, drawFindings, drawHistory, drawSignatures } from './signoff-section';
import { drawIndependentModel } from './independent-model-section';
import { drawRecord } from './record-section';

const SECTIONS = [
  drawInputs,
  drawResults,
  drawShaftResults,
  drawPlots,
  drawChecklist,
  drawIndependentModel,
  drawFindings,
  drawSignatures,
  drawHistory,
  drawAttachments,
  drawRecord,
];

/** Lays out the whole report for gathered data; pure apart from reading the font files. */
export async function renderReport(d: ReportData, fontDir: string): Promise<Buffer> {
  const reference = `${d.calc.projectCode} / ${d.calc.number} rev ${d.revision.label}`;
  const doc = createReportDoc(fontDir, {
    title: `${d.calc.number} rev ${d.revision.label} — ${d.calc.title}`,
    subject: `Shaft calc record ${reference}`,
    author: d.revision.author.name,
  });
  const mark = stateMark(d.revision.status);
  drawTitleBlock(doc, d);
  drawNotices(doc, d, mark);
  drawKeyResults(doc, d);
  SECTIONS.forEach((draw, i) => draw(doc, d, i + 1));
  drawFurniture(doc, { organisation: d.organisation, reference, hash: d.revision.contentHash, mark });
  return toBuffer(doc);
}
