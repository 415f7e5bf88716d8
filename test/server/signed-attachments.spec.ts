import { signedInAs } from '../support/api-harness';
import { auditOf } from '../support/audit-harness';
import { calcTeam, revisionOf, sign, tickAll } from '../support/calc-harness';
import { appWithTestS3 } from '../support/s3-app';
import { pdfBytes, upload } from '../support/upload-harness';
import { getBinary, postPack, rezip, unzip } from '../support/pack-harness';
import { Signature } from '../../server/db/models';
import { currentHashOf } from '../../server/calcs/revision-read';
import { loadRevision } from '../../server/calcs/calc-access';

// Attachments are part of what is signed: each signature covers the set present when it was
// made; a file added later leaves earlier signatures over earlier content, on screen and in packs.
const ctx = appWithTestS3();

type Sig = { meaning: string; isValid: boolean; attachments: { name: string; kind: string }[] | null };
const byMeaning = (sigs: Sig[]) => Object.fromEntries(sigs.map((s) => [s.meaning, s]));

describe('attachments inside what is signed', () => {
  it('when the checker attaches a certificate after the author signed, then the author signature covers the earlier set and the checker signature covers the certificate', async () => {
    const { author, checker, revisionId } = await calcTeam(ctx.app);
    await upload(author.session, revisionId, pdfBytes(900, 'drawing'), { kind: 'drawing' }, 'DRG-1.pdf');
    expect((await sign(author.session, revisionId, 'authored')).status).toBe(200);

    expect(
      (
        await upload(
          checker.session,
          revisionId,
          pdfBytes(700, 'mill cert'),
          { kind: 'material-certificate' },
          'mill cert.pdf',
        )
      ).status,
    ).toBe(201);
    const afterUpload = byMeaning((await revisionOf(checker.session, revisionId)).signatures);
    await tickAll(checker.session, revisionId);
    expect((await sign(checker.session, revisionId, 'checked')).status).toBe(200);
    const sigs = byMeaning((await revisionOf(checker.session, revisionId)).signatures);

    expect(afterUpload.authored.isValid).toBe(false);
    expect(sigs.authored.attachments!.map((a) => a.name)).toContain('DRG-1.pdf');
    expect(sigs.authored.attachments!.map((a) => a.name)).not.toContain('mill cert.pdf');
    expect(sigs.checked.isValid).toBe(true);
    expect(sigs.checked.attachments!.map((a) => a.name)).toEqual(
      expect.arrayContaining(['DRG-1.pdf', 'mill cert.pdf']),
    );
  });

  it('when the approver attaches a file after the check, then author and checker signatures no longer hold and the approval covers it', async () => {
    const { author, checker, approver, revisionId } = await calcTeam(ctx.app);
    await sign(author.session, revisionId, 'authored');
    await tickAll(checker.session, revisionId);
    await sign(checker.session, revisionId, 'checked');

    expect(
      (await upload(approver.session, revisionId, pdfBytes(500, 'site note'), { kind: 'other' }, 'site note.pdf'))
        .status,
    ).toBe(201);
    expect((await sign(approver.session, revisionId, 'approved')).status).toBe(200);
    const sigs = byMeaning((await revisionOf(approver.session, revisionId)).signatures);

    expect([sigs.authored.isValid, sigs.checked.isValid, sigs.approved.isValid]).toEqual([false, false, true]);
    expect(sigs.approved.attachments!.map((a) => a.name)).toContain('site note.pdf');
    expect(sigs.checked.attachments!.map((a) => a.name)).not.toContain('site note.pdf');
  });

  it("when the checker attached a file during check, then the approved calc's evidence pack still verifies, naming what each signature covered", async () => {
    const team = await calcTeam(ctx.app);
    const { author, checker, approver, revisionId } = team;
    // The author's own files are uploaded (the harness would otherwise insert rows for the kinds manual items need).
    await upload(author.session, revisionId, pdfBytes(900, 'drawing'), { kind: 'drawing' }, 'DRG-1.pdf');
    await upload(
      author.session,
      revisionId,
      pdfBytes(800, 'certificate'),
      { kind: 'material-certificate' },
      'cert.pdf',
    );
    await sign(author.session, revisionId, 'authored');
    await upload(checker.session, revisionId, pdfBytes(700, 'hardness test'), { kind: 'other' }, 'hardness-test.pdf');
    await tickAll(checker.session, revisionId);
    await sign(checker.session, revisionId, 'checked');
    await sign(approver.session, revisionId, 'approved');
    const compliance = await signedInAs(ctx.app, ['compliance']);
    const exported = await getBinary(compliance.session, `/api/calcs/${team.calc.id}/evidence.zip`);
    expect([
      exported.status,
      exported.status === 200 ? '' : String(exported.body),
      (await revisionOf(approver.session, revisionId)).status,
    ]).toEqual([200, '', 'approved']);
    const pack = exported.body as Buffer;

    const verified = await postPack(compliance.session, pack);
    expect([verified.status, verified.body.message]).toEqual([200, undefined]);
    const authored = verified.body.checks.find((c: { name: string }) => /signature authored/.test(c.name));

    expect(verified.body.checks.filter((c: { ok: boolean }) => !c.ok)).toEqual([]);
    expect(verified.body.ok).toBe(true);
    expect(authored.detail).toMatch(
      /attachments DRG-1\.pdf, cert\.pdf; added after this signature: hardness-test\.pdf/,
    );
  });

  it('when anyone tries to attach a file after approval, then it is refused and the signatures still hold', async () => {
    const { author, checker, approver, revisionId } = await calcTeam(ctx.app);
    await sign(author.session, revisionId, 'authored');
    await tickAll(checker.session, revisionId);
    await sign(checker.session, revisionId, 'checked');
    await sign(approver.session, revisionId, 'approved');

    const res = await upload(approver.session, revisionId, pdfBytes(500, 'late'), { kind: 'other' }, 'late.pdf');

    expect(res.status).toBe(409);
    expect((await revisionOf(approver.session, revisionId)).signatures.map((s: Sig) => s.isValid)).toEqual([
      true,
      true,
      true,
    ]);
  });

  it('when a signature was made before attachments were signed (format 1), then it still verifies as it did', async () => {
    const { author, revisionId } = await calcTeam(ctx.app);
    await sign(author.session, revisionId, 'authored');
    // Rewrite the signature as one made before this change: format 1 hash, no attachment set.
    const v1 = (await currentHashOf(await loadRevision(revisionId), undefined, undefined, 1))!;
    await Signature.update({ contentHash: v1, contentFormat: 1, attachments: null }, { where: { revisionId } });

    const sig = (await revisionOf(author.session, revisionId)).signatures[0];

    expect([sig.isValid, sig.contentFormat, sig.attachments]).toEqual([true, 1, null]);
  });

  it('when a pack’s attachment list is altered, then verification fails; a new revision carries attachments over only when asked, and the trail says so', async () => {
    const team = await calcTeam(ctx.app);
    const { author, checker, approver, revisionId } = team;
    await upload(author.session, revisionId, pdfBytes(900, 'drawing'), { kind: 'drawing' }, 'DRG-1.pdf');
    await upload(
      author.session,
      revisionId,
      pdfBytes(800, 'certificate'),
      { kind: 'material-certificate' },
      'cert.pdf',
    );
    await sign(author.session, revisionId, 'authored');
    await tickAll(checker.session, revisionId);
    await sign(checker.session, revisionId, 'checked');
    await sign(approver.session, revisionId, 'approved');
    const compliance = await signedInAs(ctx.app, ['compliance']);
    const files = await unzip(
      (await getBinary(compliance.session, `/api/calcs/${team.calc.id}/evidence.zip`)).body as Buffer,
    );
    const record = JSON.parse(files.get('revisions/A/record.json')!.toString('utf8'));
    record.attachments = record.attachments.filter((a: { fileName: string }) => a.fileName !== 'DRG-1.pdf');
    files.set('revisions/A/record.json', Buffer.from(JSON.stringify(record, null, 2)));

    const verified = await postPack(compliance.session, await rezip(files));

    expect(verified.body.ok).toBe(false);
    expect(verified.body.checks).toEqual(
      expect.arrayContaining([expect.objectContaining({ name: 'revisions/A/record.json attachment list', ok: false })]),
    );

    const carried = await author.session.post(`/api/calcs/${team.calc.id}/revisions`, {
      reasonForChange: 'Keyway moved 5 mm',
      carryAttachments: true,
    });
    expect(carried.status).toBe(201);
    const listed = await author.session.get(`/api/revisions/${carried.body.id}/attachments`);
    expect(listed.body.items.map((a: { fileName: string }) => a.fileName)).toContain('DRG-1.pdf');
    const created = (await auditOf('Revision', carried.body.id)).find((e) => e.action === 'revision.created')!;
    expect(created.payload.attachmentsCarriedOver.map((a: { name: string }) => a.name)).toContain('DRG-1.pdf');
  });
});
