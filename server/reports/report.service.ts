import type { AppAbility } from '../../shared/authz/app-ability';
import { loadReportData, type ReportContext, type ReportData } from './report-data';
import { createReportDoc, toBuffer } from './report-doc';
import { drawFurniture, stateMark } from './page-furniture';
import { drawTitleBlock } from './title-block';
import { drawKeyResults, drawNotices } from './front-matter';
import { drawInputs } from './inputs-section';
import { drawResults } from './results-section';
import { drawShaftResults } from './shaft-results-section';
import { drawPlots } from './plots-section';
import { drawChecklist } from './checklist-section';
import { drawAttachments, drawFindings, drawHistory, drawSignatures } from './signoff-section';
import { drawIndependentModel } from './independent-model-section';
import { drawRecord } from './record-section';
import type { WorkPool } from '../workers/work-pool';

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

/** The calc report of one revision, as a PDF, for anyone who may read the revision. */
export class ReportService {
  /** Without a pool (scripts, some tests) the layout runs in this thread. */
  constructor(
    private readonly fontDir: string,
    private readonly work?: WorkPool,
  ) {}

  async pdf(
    ability: AppAbility,
    revisionId: number,
    ctx: ReportContext,
  ): Promise<{ fileName: string; bytes: Buffer; data: ReportData }> {
    const data = await loadReportData(ability, revisionId, ctx);
    // Laying out a long report takes the CPU for a while: off the event loop when a pool is given.
    const bytes = this.work
      ? asBuffer(await this.work.run<Uint8Array>('renderReportPdf', { data, fontDir: this.fontDir }))
      : await renderReport(data, this.fontDir);
    const fileName = `${data.calc.projectCode}_${data.calc.number}_rev-${data.revision.label}.pdf`.replace(
      /[^A-Za-z0-9._-]+/g,
      '-',
    );
    return { fileName, bytes, data };
  }
}

/** A worker's Buffer arrives as a plain Uint8Array; view the same bytes as a Buffer again. */
function asBuffer(bytes: Uint8Array): Buffer {
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}
