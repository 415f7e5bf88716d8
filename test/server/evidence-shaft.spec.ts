import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { signedInAs } from '../support/api-harness';
import { calcTeam, revisionOf, sign, tickAll } from '../support/calc-harness';
import { appWithTestS3 } from '../support/s3-app';
import { pdfBytes, upload } from '../support/upload-harness';
import { getBinary, postPack, unzip } from '../support/pack-harness';
import { wholeShaftInput } from '../support/shaft-fixture';

// A whole-shaft calc's bearings, forces and results travel in the revision's input and result, so the
// content hash and the evidence pack must cover them: a changed load rating is a changed record.
const ctx = appWithTestS3();

const sha256 = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');

describe('evidence of a whole-shaft calc', () => {
  it("when a bearing's load rating changes, then the content hash changes with it", async () => {
    const { author, revisionId } = await calcTeam(ctx.app, wholeShaftInput());
    const before = await revisionOf(author.session, revisionId);
    const input = structuredClone(before.input);
    input.supports[0].C = 30;
    const res = await author.session.put(`/api/revisions/${revisionId}`, { input, lockVersion: before.lockVersion });
    expect(res.status).toBe(200);
    const after = await revisionOf(author.session, revisionId);

    expect(after.contentHash).not.toBe(before.contentHash);
    expect(after.result.supports[0].L10).toBeGreaterThan(before.result.supports[0].L10);
  });

  it('when an approved whole-shaft calc is exported, then its record holds the bearings, loads and beam results, and the pack verifies', async () => {
    const team = await calcTeam(ctx.app, wholeShaftInput());
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
    const zip = (await getBinary(compliance.session, `/api/calcs/${team.calc.id}/evidence.zip`)).body as Buffer;
    const files = await unzip(zip);
    const record = JSON.parse(files.get('revisions/A/record.json')!.toString('utf8'));

    expect(record.content.input.supports.map((s: { at: number }) => s.at)).toEqual([20, 300]);
    expect(record.content.input.loads[0]).toMatchObject({ kind: 'gear', pitchDiameter: 180 });
    expect(record.content.result.supports).toHaveLength(2);
    expect(record.content.result.criticalSpeed.rpm).toBeGreaterThan(0);
    expect(sha256(canonicalize(record.content)!)).toBe((await revisionOf(author.session, revisionId)).contentHash);
    const verified = await postPack(compliance.session, zip);
    expect(verified.body.ok).toBe(true);
  });
});
