import { crc32 } from 'node:zlib';
import yauzl, { type Entry, type ZipFile } from 'yauzl';
import { AppError } from '../errors/app-error';

/** More entries than any pack Torquetrail writes; a cap on the work a crafted directory can ask for. */
const MAX_ENTRIES = 20_000;

function refuse(reason: string): AppError {
  return AppError.validation({ file: [reason] });
}

const open = (zip: Buffer): Promise<ZipFile> =>
  new Promise((resolve, reject) => {
    // strictFileNames refuses "..", absolute and backslash names; sizes are cross-checked while reading.
    yauzl.fromBuffer(
      zip,
      { lazyEntries: true, strictFileNames: true, validateEntrySizes: true, decodeStrings: true },
      (err, zipfile) => (err ? reject(err) : resolve(zipfile)),
    );
  });

function readEntry(zipfile: ZipFile, entry: Entry, room: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    zipfile.openReadStream(entry, (err, stream) => {
      if (err) return reject(err);
      const chunks: Buffer[] = [];
      let size = 0;
      stream.on('data', (chunk: Buffer) => {
        size += chunk.length;
        // The declared size is checked before reading; this stops a stream that lies about it.
        if (size > room) stream.destroy(refuse('unpacks to more than the size limit'));
        else chunks.push(chunk);
      });
      stream.on('error', reject);
      stream.on('end', () => resolve(Buffer.concat(chunks)));
    });
  });
}

async function readAll(zipfile: ZipFile, maxTotal: number): Promise<Map<string, Buffer>> {
  const files = new Map<string, Buffer>();
  let total = 0;
  for (let entry = await nextEntry(zipfile); entry; entry = await nextEntry(zipfile)) {
    if (files.size >= MAX_ENTRIES) throw refuse(`holds more than ${MAX_ENTRIES} files`);
    const name = entry.fileName;
    if (name.endsWith('/')) continue;
    if (entry.isEncrypted()) throw refuse(`holds an encrypted entry (${name})`);
    if (files.has(name)) throw refuse(`holds ${name} twice`);
    if (entry.uncompressedSize > maxTotal - total) throw refuse('unpacks to more than the size limit');
    const data = await readEntry(zipfile, entry, maxTotal - total);
    // yauzl checks sizes; the CRC is ours to check (a changed byte must not pass as the original).
    if (crc32(data) >>> 0 !== entry.crc32 >>> 0) throw refuse(`has an entry whose checksum does not match (${name})`);
    total += data.length;
    files.set(name, data);
  }
  return files;
}

function nextEntry(zipfile: ZipFile): Promise<Entry | null> {
  return new Promise((resolve, reject) => {
    const cleanup = () => zipfile.removeAllListeners('entry').removeAllListeners('end').removeAllListeners('error');
    zipfile.once('entry', (e: Entry) => {
      cleanup();
      resolve(e);
    });
    zipfile.once('end', () => {
      cleanup();
      resolve(null);
    });
    zipfile.once('error', (err: Error) => {
      cleanup();
      reject(err);
    });
    zipfile.readEntry();
  });
}

/**
 * Reads every file of a zip into memory with yauzl (a maintained reader that cross-checks the
 * central directory, local headers and sizes), adding a CRC-32 check and a cap on the total
 * unpacked size. Names are only map keys, never paths on disk, so a hostile archive cannot write
 * anywhere. Any fault of the archive is a 400 naming the `file` field.
 */
export async function readZip(zip: Buffer, maxTotal: number): Promise<Map<string, Buffer>> {
  if (zip.length < 22 || zip.readUInt32LE(0) !== 0x04034b50) throw refuse('is not a zip archive');
  try {
    return await readAll(await open(zip), maxTotal);
  } catch (err) {
    if (err instanceof AppError) throw err;
    const reason = err instanceof Error ? err.message : String(err);
    throw refuse(`is not a readable zip archive (${reason})`);
  }
}
