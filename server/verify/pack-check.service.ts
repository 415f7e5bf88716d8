import { CAUTION } from '../../shared/engine';
import type { PackVerification } from '../../shared/schemas/verify.schema';
import { AppError } from '../errors/app-error';
import type { WorkPool } from '../workers/work-pool';
import type { OfflinePackResult } from '../workers/heavy-work';
import { auditOnRecord, recordOnRecord, sealCheck } from './pack-online';

/** Checks an uploaded evidence pack: on its own first, then against this server's records. */
export class PackCheckService {
  constructor(
    readonly maxBytes: number,
    private readonly work: WorkPool,
  ) {}

  async check(zip: Buffer | undefined): Promise<PackVerification> {
    if (!zip) throw AppError.validation({ file: ['is required: send the evidence pack (.zip) as form field "file"'] });
    // Unpacking and hashing run in a worker thread; only the database look-ups stay here.
    // Packs hold PDFs and scans that barely compress; twice the upload limit is ample room to unpack.
    const copy = new Uint8Array(zip);
    const { manifest, sealHash, checks, records, auditHashes } = await this.work.run<OfflinePackResult>(
      'verifyPackOffline',
      { zip: copy, maxUnpackedBytes: this.maxBytes * 2 },
      [copy.buffer],
    );
    if (manifest && sealHash) {
      checks.push(await sealCheck(sealHash));
      for (const { path, record } of records) checks.push(await recordOnRecord(path, record));
      checks.push(await auditOnRecord(auditHashes));
    }
    return { ok: checks.every((c) => c.ok), calc: manifest?.calc ?? null, checks, caution: CAUTION };
  }
}
