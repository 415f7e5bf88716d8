import { readZip } from '../evidence/zip-reader';
import {
  auditHashes,
  packRecord,
  recordPaths,
  verifyPackFiles,
  type Manifest,
  type PackRecord,
} from '../evidence/pack-verify';
import { renderReport } from '../reports/render-report';
import type { ReportData } from '../reports/report-data';
import type { PackCheck } from '../../shared/schemas/verify.schema';
import { AppError } from '../errors/app-error';

/** Errors cross the thread boundary as plain data: a cloned Error keeps only its message. */
export type Outcome<T> =
  | { ok: true; value: T }
  | { ok: false; error: { code: string; status: number; message: string; details?: AppError['details'] } };

async function outcome<T>(work: () => T | Promise<T>): Promise<Outcome<T>> {
  try {
    return { ok: true, value: await work() };
  } catch (err) {
    if (err instanceof AppError && err.expose)
      return { ok: false, error: { code: err.code, status: err.status, message: err.message, details: err.details } };
    throw err;
  }
}

/**
 * CPU- and memory-heavy work that runs in worker threads (see work-pool.ts), never on the event
 * loop: unpacking and checking an evidence pack, and laying out a report PDF. Inputs and outputs
 * are plain data; anything that needs the database stays on the main thread.
 */

export interface OfflinePackResult {
  manifest: Manifest | null;
  sealHash: string | null;
  checks: PackCheck[];
  /** What the online checks look up: each record's path and content hash, and the audit rows' hashes. */
  records: { path: string; record: PackRecord | null }[];
  auditHashes: string[];
}

export function verifyPackOffline(input: {
  zip: Uint8Array;
  maxUnpackedBytes: number;
}): Promise<Outcome<OfflinePackResult>> {
  return outcome(() => checkPack(input));
}

async function checkPack({
  zip,
  maxUnpackedBytes,
}: {
  zip: Uint8Array;
  maxUnpackedBytes: number;
}): Promise<OfflinePackResult> {
  const files = await readZip(Buffer.from(zip.buffer, zip.byteOffset, zip.byteLength), maxUnpackedBytes);
  const { manifest, sealHash, checks } = verifyPackFiles(files);
  if (!manifest || !sealHash) return { manifest, sealHash, checks, records: [], auditHashes: [] };
  const records = recordPaths(manifest).map((path) => ({ path, record: packRecord(files, path) }));
  return { manifest, sealHash, checks, records, auditHashes: auditHashes(files) };
}

export function renderReportPdf({
  data,
  fontDir,
}: {
  data: ReportData;
  fontDir: string;
}): Promise<Outcome<Uint8Array>> {
  return outcome(() => renderReport(data, fontDir));
}
