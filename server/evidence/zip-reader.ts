import { inflateRawSync } from 'node:zlib';
import { AppError } from '../errors/app-error';

const EOCD = 0x06054b50;
const CENTRAL = 0x02014b50;
const LOCAL = 0x04034b50;

function refuse(reason: string): AppError {
  return AppError.validation({ file: [reason] });
}

function findEndOfDirectory(zip: Buffer): number {
  // The end record sits in the last 22 bytes plus at most a 64 kB comment.
  for (let i = zip.length - 22; i >= Math.max(0, zip.length - 22 - 0xffff); i--) if (zip.readUInt32LE(i) === EOCD) return i;
  throw refuse('is not a zip archive (no end-of-archive record)');
}

/**
 * Reads every entry of a zip into memory: stored and deflated entries, no encryption, no zip64.
 * Enough for evidence packs, which Torquetrail writes itself; names are only map keys, never
 * paths on disk, so a hostile archive cannot write anywhere, and `maxTotal` caps inflation.
 */
export function readZip(zip: Buffer, maxTotal: number): Map<string, Buffer> {
  if (zip.length < 22 || zip.readUInt32LE(0) !== LOCAL) throw refuse('is not a zip archive');
  const end = findEndOfDirectory(zip);
  const count = zip.readUInt16LE(end + 10);
  let p = zip.readUInt32LE(end + 16);
  const files = new Map<string, Buffer>();
  let total = 0;
  for (let i = 0; i < count; i++) {
    if (p + 46 > zip.length || zip.readUInt32LE(p) !== CENTRAL) throw refuse('has a damaged central directory');
    const flags = zip.readUInt16LE(p + 8);
    const method = zip.readUInt16LE(p + 10);
    const size = zip.readUInt32LE(p + 20);
    const nameLength = zip.readUInt16LE(p + 28);
    const local = zip.readUInt32LE(p + 42);
    const name = zip.subarray(p + 46, p + 46 + nameLength).toString('utf8');
    p += 46 + nameLength + zip.readUInt16LE(p + 30) + zip.readUInt16LE(p + 32);
    if (flags & 1) throw refuse(`holds an encrypted entry (${name})`);
    if (size === 0xffffffff || local === 0xffffffff) throw refuse('uses zip64, which evidence packs never need');
    if (name.endsWith('/')) continue;
    if (zip.readUInt32LE(local) !== LOCAL) throw refuse(`has a damaged entry (${name})`);
    const start = local + 30 + zip.readUInt16LE(local + 26) + zip.readUInt16LE(local + 28);
    const raw = zip.subarray(start, start + size);
    const data = method === 0 ? Buffer.from(raw) : method === 8 ? inflate(raw, maxTotal - total, name) : null;
    if (!data) throw refuse(`uses compression method ${method} for ${name}`);
    total += data.length;
    if (total > maxTotal) throw refuse('unpacks to more than the size limit');
    files.set(name, data);
  }
  return files;
}

function inflate(raw: Buffer, room: number, name: string): Buffer {
  try {
    return inflateRawSync(raw, { maxOutputLength: Math.max(1, room) });
  } catch {
    throw refuse(`has an entry that does not decompress (${name}), or unpacks beyond the size limit`);
  }
}
