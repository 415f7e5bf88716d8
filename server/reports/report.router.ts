import type { Router } from 'express';
import { idParam, idRouter } from '../http/route-ids';
import type { ReportService } from './report.service';

/** `/api/revisions/:id/report.pdf`: the calc report, downloaded rather than rendered in the app's origin. */
export function reportRouter(reports: ReportService, organisation: string, baseUrl: string): Router {
  const router = idRouter();
  router.get('/:id/report.pdf', async (req, res) => {
    const { fileName, bytes } = await reports.pdf(req.ability, idParam(req), {
      organisation,
      baseUrl,
      generatedBy: req.user!.displayName,
    });
    res.type('application/pdf').attachment(fileName).set({ 'Cache-Control': 'private, no-store' }).send(bytes);
  });
  return router;
}
