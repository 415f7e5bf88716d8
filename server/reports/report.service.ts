import type { AppAbility } from '../../shared/authz/app-ability';
import { loadReportData, type ReportContext, type ReportData } from './report-data';
import type { WorkPool } from '../workers/work-pool';

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
      : await (await import('./render-report')).renderReport(data, this.fontDir);
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
