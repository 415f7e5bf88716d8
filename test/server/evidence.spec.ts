import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { signedInAs, anonymousAgent } from '../support/api-harness';
import { calcTeam, revisionOf, sign, tickAll } from '../support/calc-harness';
import { appWithTestS3 } from '../support/s3-app';
import { pdfBytes, upload } from '../support/upload-harness';
import { getBinary, postPack, rezip, unzip } from '../support/pack-harness';
import { readZip } from '../../server/evidence/zip-reader';

// Evidence packs: exported by compliance, read back with an independent unzip, verified by the
// API, and then tampered with in the two ways that matter (a file, or a file and its manifest).
const ctx = appWithTestS3();

const sha256 = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');

async function approvedCalcPack() {
  const team = await calcTeam(ctx.app);
  const { author, checker, approver, revisionId } = team;
  await upload(author.session, revisionId, pdfBytes(2000, 'drawing'), { kind: 'drawing' }, 'DRG-1.pdf');
  await upload(
    author.session,
    revisionId,
    pdfBytes(1500, 'certificate'),
    { kind: 'material-certificate' },
    'mill cert.pdf',
  );
  await sign(author.session, revisionId, 'authored');
  await tickAll(checker.session, revisionId);
  await sign(checker.session, revisionId, 'checked');
  await sign(approver.session, revisionId, 'approved');
  const compliance = await signedInAs(ctx.app, ['compliance']);
  const res = await getBinary(compliance.session, `/api/calcs/${team.calc.id}/evidence.zip`);
  return { ...team, compliance, res, zip: res.body as Buffer };
}

describe('evidence pack', () => {
  it('when compliance exports a pack, then it holds the report, record, attachments and audit excerpt, and every hash verifies', async () => {
    const { compliance, res, zip, revisionId, author } = await approvedCalcPack();
    const files = await unzip(zip);
    const manifest = JSON.parse(files.get('manifest.json')!.toString('utf8'));
    const record = JSON.parse(files.get('revisions/A/record.json')!.toString('utf8'));

    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?evidence_[\w.-]+\.zip"?$/);
    expect([...files.keys()].sort()).toEqual(
      expect.arrayContaining([
        'README.txt',
        'audit-trail.json',
        'manifest.json',
        'manifest.sha256',
        'revisions/A/record.json',
        'revisions/A/report.pdf',
        expect.stringMatching(/^revisions\/A\/attachments\/\d+-mill-cert\.pdf$/),
      ]),
    );
    for (const f of manifest.files) expect([f.path, sha256(files.get(f.path)!)]).toEqual([f.path, f.sha256]);
    expect(files.get('manifest.sha256')!.toString().trim()).toBe(sha256(files.get('manifest.json')!));
    expect(res.headers['x-evidence-seal']).toBe(sha256(files.get('manifest.json')!));
    expect(sha256(canonicalize(record.content)!)).toBe((await revisionOf(author.session, revisionId)).contentHash);
    expect(record.signatures.map((s: { contentHash: string }) => s.contentHash)).toEqual([
      record.contentHash,
      record.contentHash,
      record.contentHash,
    ]);
    expect(files.get('revisions/A/report.pdf')!.subarray(0, 5).toString()).toBe('%PDF-');

    const verified = await postPack(compliance.session, zip);
    expect(verified.status).toBe(200);
    expect(verified.body.checks.filter((c: { ok: boolean }) => !c.ok)).toEqual([]);
    expect(verified.body.ok).toBe(true);
  });

  it("when the server's zip reader and unzipper read the same pack, then they agree byte for byte", async () => {
    const { zip } = await approvedCalcPack();
    const theirs = await unzip(zip);
    const ours = await readZip(zip, 100 * 1024 * 1024);
    expect([...ours.keys()].sort()).toEqual([...theirs.keys()].sort());
    for (const [name, data] of theirs) expect(Buffer.compare(ours.get(name)!, data)).toBe(0);
  });

  it('when one file in the pack is changed, then verification fails and names that file', async () => {
    const { compliance, zip } = await approvedCalcPack();
    const files = await unzip(zip);
    const record = JSON.parse(files.get('revisions/A/record.json')!.toString('utf8'));
    record.content.result.maxShear.value /= 2;
    files.set('revisions/A/record.json', Buffer.from(JSON.stringify(record, null, 2)));

    const res = await postPack(compliance.session, await rezip(files));

    expect(res.body.ok).toBe(false);
    const failed = res.body.checks.filter((c: { ok: boolean }) => !c.ok).map((c: { name: string }) => c.name);
    expect(failed).toEqual(expect.arrayContaining(['revisions/A/record.json', 'revisions/A/record.json content']));
    // Every line's mark agrees with its meaning: no signature is ticked as good over altered content.
    const signatures = res.body.checks.filter((c: { name: string }) => /signature/.test(c.name));
    expect(signatures).toHaveLength(3);
    for (const c of signatures)
      expect(c).toEqual(
        expect.objectContaining({ ok: false, detail: expect.stringMatching(/not valid for this content/) }),
      );
  });

  it('when a file and the manifest are both rewritten to match, then the seal and the record hash still expose it', async () => {
    const { compliance, zip } = await approvedCalcPack();
    const files = await unzip(zip);
    const record = JSON.parse(files.get('revisions/A/record.json')!.toString('utf8'));
    record.content.input.segments[0].od = 60;
    record.contentHash = sha256(canonicalize(record.content)!);
    files.set('revisions/A/record.json', Buffer.from(JSON.stringify(record, null, 2)));
    const manifest = JSON.parse(files.get('manifest.json')!.toString('utf8'));
    for (const f of manifest.files)
      Object.assign(f, { sha256: sha256(files.get(f.path)!), size: files.get(f.path)!.length });
    files.set('manifest.json', Buffer.from(JSON.stringify(manifest, null, 2)));
    files.set('manifest.sha256', Buffer.from(sha256(files.get('manifest.json')!)));

    const res = await postPack(compliance.session, await rezip(files));

    const failed = res.body.checks.filter((c: { ok: boolean }) => !c.ok).map((c: { name: string }) => c.name);
    expect(res.body.ok).toBe(false);
    expect(failed).toEqual(expect.arrayContaining(['seal', 'revisions/A/record.json on record']));
    expect(failed.filter((n: string) => /signature/.test(n))).toHaveLength(3);
  });

  it('when the upload is not a zip, then it is a 400 naming the file field', async () => {
    const { session } = await signedInAs(ctx.app, ['author']);
    const res = await postPack(session, Buffer.from('%PDF-1.4 not a zip'));
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors).toEqual({ file: ['is not a zip archive'] });
  });

  it('when someone other than compliance asks for a pack, or nobody is signed in, or the calc is missing, then 403, 401 and 404', async () => {
    const { author, calc } = await calcTeam(ctx.app);
    const compliance = await signedInAs(ctx.app, ['compliance']);
    const { agent } = await anonymousAgent(ctx.app);

    expect((await author.session.get(`/api/calcs/${calc.id}/evidence.zip`)).status).toBe(403);
    expect((await agent.get(`/api/calcs/${calc.id}/evidence.zip`)).status).toBe(401);
    expect((await compliance.session.get('/api/calcs/999999999/evidence.zip')).status).toBe(404);
  });
});
