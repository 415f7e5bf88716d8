import { Router } from 'express';
import { CAUTION } from '../../shared/engine';
import { recordHashSchema, type PackVerification } from '../../shared/schemas/verify.schema';
import { validate } from '../http/validate';
import { AppError } from '../errors/app-error';
import { singleUpload } from '../attachments/upload';
import type { WorkPool } from '../workers/work-pool';
import type { OfflinePackResult } from '../workers/heavy-work';
import { verifyRecordHash } from './verify.service';
import { auditOnRecord, recordOnRecord, sealCheck } from './pack-online';

/** Checks an uploaded evidence pack: on its own first, then against this server's records. */
async function verifyPack(zip: Buffer, maxBytes: number, work: WorkPool): Promise<PackVerification> {
  // Unpacking and hashing run in a worker thread; only the database look-ups stay here.
  // Packs hold PDFs and scans that barely compress; twice the upload limit is ample room to unpack.
  const copy = new Uint8Array(zip);
  const { manifest, sealHash, checks, records, auditHashes } = await work.run<OfflinePackResult>(
    'verifyPackOffline', { zip: copy, maxUnpackedBytes: maxBytes * 2 }, [copy.buffer],
  );
  if (manifest && sealHash) {
    checks.push(await sealCheck(sealHash));
    for (const { path, record } of records) checks.push(await recordOnRecord(path, record));
    checks.push(await auditOnRecord(auditHashes));
  }
  return { ok: checks.every((c) => c.ok), calc: manifest?.calc ?? null, checks, caution: CAUTION };
}

/** `/api/verify`: anyone signed in can check a record hash or an evidence pack. */
export function verifyRouter(packMaxBytes: number, work: WorkPool): Router {
  const router = Router();
  router.post('/pack', singleUpload('file', packMaxBytes), async (req, res) => {
    if (!req.file) throw AppError.validation({ file: ['is required: send the evidence pack (.zip) as form field "file"'] });
    res.json(await verifyPack(req.file.buffer, packMaxBytes, work));
  });
  router.get('/:hash', validate({ params: recordHashSchema }), async (req, res) => {
    res.json(await verifyRecordHash(String(req.params.hash)));
  });
  return router;
}
