// The other spec files' apps start their worker threads from a bundle built once per run (HEAVY_WORK_BUNDLE, set by
// test/support/api-global-setup.ts). This file runs the product's own entry, heavy-work.entry.cjs under tsx, as
// `npm start` does, and checks that both give the same answers.
import { WorkPool } from '../../server/workers/work-pool';
import type { OfflinePackResult } from '../../server/workers/heavy-work';
import { rezip } from '../support/pack-harness';

const bundle = process.env.HEAVY_WORK_BUNDLE;
const limits = { threads: 1, memoryMb: 256, queue: 4 };

/** A pool whose threads load the product's entry (no bundle) or the test bundle. */
function pool(from: 'entry' | 'bundle'): WorkPool {
  if (from === 'entry') delete process.env.HEAVY_WORK_BUNDLE;
  else process.env.HEAVY_WORK_BUNDLE = bundle;
  try {
    return new WorkPool(limits);
  } finally {
    process.env.HEAVY_WORK_BUNDLE = bundle;
  }
}

const pools: WorkPool[] = [];
afterAll(() => Promise.all(pools.map((p) => p.close())));

describe.each(['entry', 'bundle'] as const)('worker threads started from the %s', (from) => {
  const work = pool(from);
  pools.push(work);

  test('check a zip without a manifest and report the missing manifest', async () => {
    const zip = new Uint8Array(await rezip(new Map([['notes.txt', Buffer.from('no manifest here')]])));
    const result = await work.run<OfflinePackResult>('verifyPackOffline', { zip, maxUnpackedBytes: 1_000_000 });
    expect(result).toEqual({
      manifest: null,
      sealHash: null,
      records: [],
      auditHashes: [],
      checks: [{ name: 'manifest.json', ok: false, detail: expect.stringMatching(/^missing or not a Torquetrail/) }],
    });
  });

  test('refuse bytes that are not a zip with a 400 naming the file field', async () => {
    const zip = new Uint8Array(Buffer.from('plain text, not an archive'));
    await expect(work.run('verifyPackOffline', { zip, maxUnpackedBytes: 1_000 })).rejects.toMatchObject({
      status: 400,
      details: { fieldErrors: { file: ['is not a zip archive'] } },
    });
  });
});

test('the test bundle is in use for the other spec files', () => {
  expect(bundle).toMatch(/heavy-work-ts\.cjs$/);
});
