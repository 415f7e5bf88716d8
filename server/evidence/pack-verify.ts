import type { PackCheck } from '../../shared/schemas/verify.schema';
import { chainHash, type ChainedContent } from '../audit/audit-chain';
import { contentHash, sha256, RECORD_FORMAT, type RecordAttachment } from './record-json';
import { attachmentListCheck, signatureCheck, type PackSignature } from './signature-checks';

export const MANIFEST_FORMAT = 'torquetrail-evidence/1';

export interface Manifest { format: string; calc: string; exportedAt: string; exportedBy: string; files: { path: string; sha256: string; size: number }[] }
export interface PackRecord { format: string; contentHash: string | null; content: Record<string, unknown>; signatures: PackSignature[]; attachments: RecordAttachment[] }
type AuditRow = ChainedContent & { id: number; prevHash: string; hash: string };

const SEAL_FILES = new Set(['manifest.json', 'manifest.sha256']);

export function parse<T>(files: Map<string, Buffer>, name: string): T | null {
  try {
    return JSON.parse(files.get(name)?.toString('utf8') ?? 'null') as T | null;
  } catch {
    return null;
  }
}

function fileChecks(files: Map<string, Buffer>, manifest: Manifest): PackCheck[] {
  const listed = new Set(manifest.files.map((f) => f.path));
  const checks = manifest.files.map((f): PackCheck => {
    const data = files.get(f.path);
    if (!data) return { name: f.path, ok: false, detail: 'listed in the manifest but missing from the pack' };
    const ok = sha256(data) === f.sha256 && data.length === f.size;
    return { name: f.path, ok, detail: ok ? 'SHA-256 matches the manifest' : 'content differs from the manifest: the file was changed' };
  });
  for (const name of files.keys()) {
    if (!listed.has(name) && !SEAL_FILES.has(name)) checks.push({ name, ok: false, detail: 'not listed in the manifest: added after export' });
  }
  return checks;
}

function recordChecks(files: Map<string, Buffer>, path: string): PackCheck[] {
  const record = parse<PackRecord>(files, path);
  if (!record || record.format !== RECORD_FORMAT) return [{ name: path, ok: false, detail: 'is not a Torquetrail record' }];
  const checks: PackCheck[] = [];
  if (record.contentHash) {
    const ok = contentHash(record.content) === record.contentHash;
    checks.push({ name: `${path} content`, ok, detail: ok ? 'recomputed content hash equals the record hash' : 'recomputed content hash differs: the record content was changed' });
    // A hand-edited record may hold anything: judge what is there, never throw.
    const content = record.content && typeof record.content === 'object' ? record.content : {};
    checks.push(...attachmentListCheck(path, content, Array.isArray(record.attachments) ? record.attachments : []));
    for (const s of Array.isArray(record.signatures) ? record.signatures : []) checks.push(signatureCheck(path, record.contentHash, content, s));
  }
  for (const a of record.attachments) {
    const data = files.get(a.path);
    const ok = !!data && sha256(data) === a.sha256;
    checks.push({ name: a.path, ok, detail: ok ? 'matches the SHA-256 in the record' : 'missing or different from the SHA-256 in the record' });
  }
  return checks;
}

function auditChecks(files: Map<string, Buffer>): PackCheck[] {
  const trail = parse<{ events: AuditRow[] }>(files, 'audit-trail.json');
  if (!trail || !Array.isArray(trail.events)) return [{ name: 'audit-trail.json', ok: false, detail: 'missing or unreadable' }];
  const broken = trail.events.filter(({ id: _id, prevHash, hash, ...content }) => chainHash(prevHash, content) !== hash);
  return [{
    name: 'audit-trail.json', ok: broken.length === 0,
    detail: broken.length === 0 ? `${trail.events.length} rows; every row's hash recomputes` : `rows ${broken.map((r) => r.id).join(', ')} do not match their hashes`,
  }];
}

/**
 * Checks a pack on its own, without the database: manifest seal, every file against the
 * manifest, each record's content against its hash, attachments, and the audit rows' hashes.
 */
export function verifyPackFiles(files: Map<string, Buffer>): { manifest: Manifest | null; sealHash: string | null; checks: PackCheck[] } {
  const manifest = parse<Manifest>(files, 'manifest.json');
  if (!manifest || manifest.format !== MANIFEST_FORMAT || !Array.isArray(manifest.files)) {
    return { manifest: null, sealHash: null, checks: [{ name: 'manifest.json', ok: false, detail: 'missing or not a Torquetrail evidence manifest' }] };
  }
  const sealHash = sha256(files.get('manifest.json')!);
  const written = files.get('manifest.sha256')?.toString('utf8').trim();
  const checks: PackCheck[] = [{ name: 'manifest.sha256', ok: written === sealHash, detail: written === sealHash ? 'matches manifest.json' : 'does not match manifest.json' }];
  checks.push(...fileChecks(files, manifest));
  for (const f of manifest.files.filter((x) => x.path.endsWith('/record.json'))) checks.push(...recordChecks(files, f.path));
  checks.push(...auditChecks(files));
  return { manifest, sealHash, checks };
}
