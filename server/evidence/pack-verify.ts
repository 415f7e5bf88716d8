import type { PackCheck } from '../../shared/schemas/verify.schema';
import { chainHash } from '../audit/audit-chain';
import { contentHash, sha256 } from './record-json';
import {
  auditTrailSchema,
  manifestSchema,
  packRecordSchema,
  readPackJson,
  type Manifest,
  type PackRecord,
} from './pack-schema';

export { MANIFEST_FORMAT, type Manifest, type PackRecord } from './pack-schema';
import { attachmentListCheck, signatureCheck } from './signature-checks';

const SEAL_FILES = new Set(['manifest.json', 'manifest.sha256']);

/** The records a manifest lists, in its order. */
export const recordPaths = (manifest: Manifest): string[] =>
  manifest.files.map((f) => f.path).filter((p) => p.endsWith('/record.json'));

/** A record file of the pack, or null when it is missing or does not fit the record schema. */
export function packRecord(files: Map<string, Buffer>, path: string): PackRecord | null {
  const read = readPackJson(files, path, packRecordSchema);
  return read.ok ? read.value : null;
}

/** The hashes of the pack's audit rows (none when the trail is unreadable). */
export function auditHashes(files: Map<string, Buffer>): string[] {
  const read = readPackJson(files, 'audit-trail.json', auditTrailSchema);
  return read.ok ? read.value.events.map((e) => e.hash) : [];
}

function fileChecks(files: Map<string, Buffer>, manifest: Manifest): PackCheck[] {
  const listed = new Set(manifest.files.map((f) => f.path));
  const checks = manifest.files.map((f): PackCheck => {
    const data = files.get(f.path);
    if (!data) return { name: f.path, ok: false, detail: 'listed in the manifest but missing from the pack' };
    const ok = sha256(data) === f.sha256 && data.length === f.size;
    return {
      name: f.path,
      ok,
      detail: ok ? 'SHA-256 matches the manifest' : 'content differs from the manifest: the file was changed',
    };
  });
  for (const name of files.keys()) {
    if (!listed.has(name) && !SEAL_FILES.has(name))
      checks.push({ name, ok: false, detail: 'not listed in the manifest: added after export' });
  }
  return checks;
}

function recordChecks(files: Map<string, Buffer>, path: string): PackCheck[] {
  const read = readPackJson(files, path, packRecordSchema);
  if (!read.ok) return [{ name: path, ok: false, detail: `is not a Torquetrail record: ${read.detail}` }];
  const record = read.value;
  const checks: PackCheck[] = [];
  if (record.contentHash) {
    const actual = contentHash(record.content);
    const ok = actual === record.contentHash;
    checks.push({
      name: `${path} content`,
      ok,
      detail: ok
        ? 'recomputed content hash equals the record hash'
        : 'recomputed content hash differs: the record content was changed',
    });
    checks.push(...attachmentListCheck(path, record.content, record.attachments));
    // A signature holds only for the content actually in the pack: over altered content every mark is a failure.
    for (const s of record.signatures) checks.push(signatureCheck(path, record.contentHash, actual, record.content, s));
  }
  for (const a of record.attachments) {
    const data = files.get(a.path);
    const ok = !!data && sha256(data) === a.sha256;
    checks.push({
      name: a.path,
      ok,
      detail: ok ? 'matches the SHA-256 in the record' : 'missing or different from the SHA-256 in the record',
    });
  }
  return checks;
}

function auditChecks(files: Map<string, Buffer>): PackCheck[] {
  const read = readPackJson(files, 'audit-trail.json', auditTrailSchema);
  if (!read.ok) return [{ name: 'audit-trail.json', ok: false, detail: `missing or unreadable: ${read.detail}` }];
  const events = read.value.events;
  const broken = events.filter(({ id: _id, prevHash, hash, ...content }) => chainHash(prevHash, content) !== hash);
  return [
    {
      name: 'audit-trail.json',
      ok: broken.length === 0,
      detail:
        broken.length === 0
          ? `${events.length} rows; every row's hash recomputes`
          : `rows ${broken.map((r) => r.id).join(', ')} do not match their hashes`,
    },
  ];
}

/**
 * Checks a pack on its own, without the database: manifest seal, every file against the
 * manifest, each record's content against its hash, attachments, and the audit rows' hashes.
 * Every file is schema-checked first (pack-schema.ts), so a crafted pack fails checks, never throws.
 */
export function verifyPackFiles(files: Map<string, Buffer>): {
  manifest: Manifest | null;
  sealHash: string | null;
  checks: PackCheck[];
} {
  const read = readPackJson(files, 'manifest.json', manifestSchema);
  if (!read.ok) {
    return {
      manifest: null,
      sealHash: null,
      checks: [
        { name: 'manifest.json', ok: false, detail: `missing or not a Torquetrail evidence manifest: ${read.detail}` },
      ],
    };
  }
  const manifest = read.value;
  const sealHash = sha256(files.get('manifest.json')!);
  const written = files.get('manifest.sha256')?.toString('utf8').trim();
  const checks: PackCheck[] = [
    {
      name: 'manifest.sha256',
      ok: written === sealHash,
      detail: written === sealHash ? 'matches manifest.json' : 'does not match manifest.json',
    },
  ];
  checks.push(...fileChecks(files, manifest));
  for (const path of recordPaths(manifest)) checks.push(...recordChecks(files, path));
  checks.push(...auditChecks(files));
  return { manifest, sealHash, checks };
}
