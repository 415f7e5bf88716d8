import { PassThrough } from 'node:stream';
import archiver from 'archiver';
import fc from 'fast-check';
import { readZip } from '../../server/evidence/zip-reader';
import { verifyPackFiles, MANIFEST_FORMAT } from '../../server/evidence/pack-verify';
import { AppError } from '../../server/errors/app-error';
import { signedInAs, startTestApp } from '../support/api-harness';
import { postPack, rezip } from '../support/pack-harness';

// Crafted evidence packs: a damaged archive is a 400 naming `file`; a well-formed archive with
// crafted contents is a verification that fails with reasons. Never a 500, never an exception.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const json = (v: unknown) => Buffer.from(JSON.stringify(v));
const HASH = 'a'.repeat(64);

function pack(overrides: Record<string, unknown> = {}): Map<string, Buffer> {
  const manifest = {
    format: MANIFEST_FORMAT,
    calc: 'P-1 / C-1',
    exportedAt: '2026-12-01T00:00:00Z',
    exportedBy: 'Test',
    files: [{ path: 'revisions/A/record.json', sha256: HASH, size: 10 }],
  };
  const record = {
    format: 'torquetrail-record/1',
    contentHash: HASH,
    content: { a: 1 },
    signatures: [],
    attachments: [],
  };
  return new Map([
    ['manifest.json', json(overrides.manifest ?? manifest)],
    ['revisions/A/record.json', json(overrides.record ?? record)],
    ['audit-trail.json', json(overrides.trail ?? { events: [] })],
  ]);
}

async function storedZip(files: Map<string, Buffer>): Promise<Buffer> {
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise((resolve) => out.on('end', resolve));
  const zip = archiver('zip', { store: true });
  zip.pipe(out);
  for (const [name, data] of files) zip.append(data, { name });
  await zip.finalize();
  await done;
  return Buffer.concat(chunks);
}

let session: Awaited<ReturnType<typeof signedInAs>>['session'];
beforeAll(async () => {
  ({ session } = await signedInAs(app, ['compliance']));
});

describe('crafted packs through the API', () => {
  it.each([
    [
      'files: [null]',
      { manifest: { format: MANIFEST_FORMAT, calc: 'x', exportedAt: 'x', exportedBy: 'x', files: [null] } },
      'manifest.json',
      /files\[0\]/,
    ],
    [
      'a numeric path',
      {
        manifest: {
          format: MANIFEST_FORMAT,
          calc: 'x',
          exportedAt: 'x',
          exportedBy: 'x',
          files: [{ path: 7, sha256: HASH, size: 1 }],
        },
      },
      'manifest.json',
      /files\[0\]\.path/,
    ],
    [
      'signatures that are not a list',
      {
        record: {
          format: 'torquetrail-record/1',
          contentHash: HASH,
          content: {},
          signatures: 'all of them',
          attachments: [],
        },
      },
      'revisions/A/record.json',
      /signatures/,
    ],
    ['events: [null]', { trail: { events: [null] } }, 'audit-trail.json', /events\[0\]/],
    ['a duplicate key', { trail: '{"events":[],"events":[1]}' }, 'audit-trail.json', /twice/],
  ])(
    'when the pack has %s, then verification fails on that file and names the field',
    async (_what, overrides: Record<string, unknown>, file, detail) => {
      const files = pack(overrides);
      if (typeof overrides.trail === 'string') files.set('audit-trail.json', Buffer.from(overrides.trail));
      const res = await postPack(session, await rezip(files));
      expect(res.status).toBe(200);
      expect(res.body.ok).toBe(false);
      const failed = res.body.checks.filter((c: { name: string; ok: boolean }) => c.name === file && !c.ok);
      expect(failed.map((c: { detail: string }) => c.detail)).toContainEqual(expect.stringMatching(detail));
    },
  );

  it('when the central directory points past the end of the file, then it is a 400 naming file', async () => {
    const zip = await storedZip(pack());
    const end = zip.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06]));
    zip.writeUInt32LE(zip.length + 1000, end + 16);
    const res = await postPack(session, zip);
    expect([res.status, Object.keys(res.body.fieldErrors ?? {})]).toEqual([400, ['file']]);
  });

  it('when a byte of a stored file is changed inside the zip, then the CRC check refuses it', async () => {
    const zip = await storedZip(new Map([['note.txt', Buffer.from('the quick brown fox')]]));
    zip[zip.indexOf('quick')] ^= 0x20;
    await expect(readZip(zip, 1e6)).rejects.toMatchObject({
      status: 400,
      details: { fieldErrors: { file: [expect.stringMatching(/checksum/)] } },
    });
  });

  it('when a pack unpacks beyond the limit, then it is refused before it is read', async () => {
    const zip = await storedZip(new Map([['big.bin', Buffer.alloc(50_000)]]));
    await expect(readZip(zip, 10_000)).rejects.toMatchObject({
      status: 400,
      details: { fieldErrors: { file: ['unpacks to more than the size limit'] } },
    });
  });
});

describe('verifier fuzz', () => {
  it('when a valid zip has bytes changed, cut or appended, then reading it resolves or is a 400, never another error', async () => {
    const zip = await storedZip(pack());
    const change = fc.oneof(
      fc.tuple(fc.nat(zip.length - 1), fc.integer({ min: 1, max: 255 })).map(([at, x]) => {
        const b = Buffer.from(zip);
        b[at] ^= x;
        return b;
      }),
      fc.nat(zip.length).map((n) => zip.subarray(0, n)),
      fc.uint8Array({ maxLength: 64 }).map((tail) => Buffer.concat([zip, Buffer.from(tail)])),
    );
    await fc.assert(
      fc.asyncProperty(change, async (bytes) => {
        try {
          verifyPackFiles(await readZip(bytes, 1e6));
        } catch (err) {
          expect(err).toBeInstanceOf(AppError);
          expect((err as AppError).status).toBe(400);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('when manifest, record and audit trail are arbitrary JSON, then verification reports failed checks and never throws', () => {
    const anyJson = fc.oneof(
      fc.jsonValue({ maxDepth: 4 }),
      fc.record({
        format: fc.constant(MANIFEST_FORMAT),
        files: fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 4 }),
      }),
      fc.record({ events: fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 4 }) }),
    );
    fc.assert(
      fc.property(anyJson, anyJson, anyJson, fc.string(), (manifest, record, trail, seal) => {
        const files = pack({ manifest, record, trail });
        files.set('manifest.sha256', Buffer.from(seal));
        const { checks } = verifyPackFiles(files);
        expect(checks.length).toBeGreaterThan(0);
      }),
      { numRuns: 500 },
    );
  });
});
