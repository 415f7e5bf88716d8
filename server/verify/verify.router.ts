import { Router } from 'express';
import { recordHashSchema } from '../../shared/schemas/verify.schema';
import { validate } from '../http/validate';
import { singleUpload } from '../attachments/upload';
import { verifyRecordHash } from './verify.service';
import type { PackCheckService } from './pack-check.service';

/** `/api/verify`: anyone signed in can check a record hash or an evidence pack. */
export function verifyRouter(packs: PackCheckService): Router {
  const router = Router();
  router.post('/pack', singleUpload('file', packs.maxBytes), async (req, res) => {
    res.json(await packs.check(req.file?.buffer));
  });
  router.get('/:hash', validate({ params: recordHashSchema }), async (req, res) => {
    res.json(await verifyRecordHash(String(req.params.hash)));
  });
  return router;
}
