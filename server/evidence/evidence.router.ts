import type { Router } from 'express';
import { idParam, idRouter } from '../http/route-ids';
import { signedInActor } from '../authz/actor';
import { logger } from '../logger';
import { writeZip, type EvidenceService } from './evidence.service';

/** `/api/calcs/:id/evidence.zip`: compliance's export of a calc's whole record. */
export function evidenceRouter(evidence: EvidenceService, organisation: string, baseUrl: string): Router {
  const router = idRouter();
  router.get('/:id/evidence.zip', async (req, res) => {
    const actor = signedInActor(req);
    const pack = await evidence.build(req.ability, actor, idParam(req), {
      organisation,
      baseUrl,
      generatedBy: actor.name,
    });
    res
      .type('application/zip')
      .attachment(pack.fileName)
      .set({ 'Cache-Control': 'private, no-store', 'X-Evidence-Seal': pack.sealHash });
    // Headers are gone once streaming starts; a broken connection is logged, not answered.
    await writeZip(pack.files, res).catch((err) => logger.warn({ err }, 'evidence pack download interrupted'));
  });
  return router;
}
