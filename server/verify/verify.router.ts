import { Router } from 'express';
import { CAUTION } from '../../shared/engine';
import { recordHashSchema, type PackVerification } from '../../shared/schemas/verify.schema';
import { validate } from '../http/validate';
import { AppError } from '../errors/app-error';
import { singleUpload } from '../attachments/upload';
import { readZip } from '../evidence/zip-reader';
import { auditHashes, packRecord, recordPaths, verifyPackFiles } from '../evidence/pack-verify';
import { verifyRecordHash } from './verify.service';
import { auditOnRecord, recordOnRecord, sealCheck } from './pack-online';

/** Checks an uploaded evidence pack: on its own first, then against this server's records. */
async function verifyPack(zip: Buffer, maxBytes: number): Promise<PackVerification> {
  // Packs hold PDFs and scans that barely compress; twice the upload limit is ample room to unpack.
  const files = await readZip(zip, maxBytes * 2);
  const { manifest, sealHash, checks } = verifyPackFiles(files);
  if (manifest && sealHash) {
    checks.push(await sealCheck(sealHash));
    for (const path of recordPaths(manifest)) checks.push(await recordOnRecord(path, packRecord(files, path)));
    checks.push(await auditOnRecord(auditHashes(files)));
  }
  return { ok: checks.every((c) => c.ok), calc: manifest?.calc ?? null, checks, caution: CAUTION };
}

/** `/api/verify`: anyone signed in can check a record hash or an evidence pack. */
export function verifyRouter(packMaxBytes: number): Router {
  const router = Router();
  router.post('/pack', singleUpload('file', packMaxBytes), async (req, res) => {
    if (!req.file) throw AppError.validation({ file: ['is required: send the evidence pack (.zip) as form field "file"'] });
    res.json(await verifyPack(req.file.buffer, packMaxBytes));
  });
  router.get('/:hash', validate({ params: recordHashSchema }), async (req, res) => {
    res.json(await verifyRecordHash(String(req.params.hash)));
  });
  return router;
}
