import { PassThrough } from 'node:stream';
import unzipper from 'unzipper';
import { writeZip } from '../../server/evidence/evidence.service';

/** Every entry of a zip, read with unzipper: an independent reader, not the server's own. */
export async function unzip(zip: Buffer): Promise<Map<string, Buffer>> {
  const dir = await unzipper.Open.buffer(zip);
  const files = new Map<string, Buffer>();
  for (const entry of dir.files) if (entry.type === 'File') files.set(entry.path, await entry.buffer());
  return files;
}

/** Packs files back into a zip, as someone editing a pack by hand would. */
export async function rezip(files: Map<string, Buffer>): Promise<Buffer> {
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on('data', (c: Buffer) => chunks.push(c));
  await writeZip(files, out);
  return Buffer.concat(chunks);
}

/** Binary GET through a signed-in agent. */
export function getBinary(s: { agent: { get: (u: string) => import('supertest').Test } }, url: string) {
  return s.agent
    .get(url)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
}

export function postPack(s: { agent: { post: (u: string) => import('supertest').Test }; csrf: string }, zip: Buffer) {
  return s.agent
    .post('/api/verify/pack')
    .set('x-csrf-token', s.csrf)
    .attach('file', zip, { filename: 'pack.zip', contentType: 'application/zip' });
}
