import { Router } from 'express';
import { idParamsSchema } from '../../shared/schemas/common.schema';
import { validate } from '../http/validate';
import type { ReportService } from './report.service';

/** `/api/revisions/:id/report.pdf`: the calc report, downloaded rather than rendered in the app's origin. */
export function reportRouter(reports: ReportService, organisation: string, baseUrl: string): Router {
  const router = Router();
  router.get('/:id/report.pdf', validate({ params: idParamsSchema }), async (req, res) => {
    const { fileName, bytes } = await reports.pdf(req.ability, Number(req.params.id), { organisation, baseUrl, generatedBy: req.user!.displayName });
    res.type('application/pdf').attachment(fileName).set({ 'Cache-Control': 'private, no-store' }).send(bytes);
  });
  return router;
}
