import { createHash } from 'node:crypto';
import { anonymousAgent } from '../support/api-harness';
import { calcTeam, revisionOf, sign, tickAll } from '../support/calc-harness';
import { appWithTestS3 } from '../support/s3-app';
import { pdfBytes, upload, windowsProgram } from '../support/upload-harness';
import { Attachment } from '../../server/db/models';
import { closeApp, createApp } from '../../server/app';

// Uploads go through multer to s3rver (the S3 API) in this process; the size limit is set low
// so "over the limit" needs only a small file.
const ctx = appWithTestS3({ ATTACHMENT_MAX_MB: 0.05 });

describe('uploading and downloading', () => {
  it('when the author attaches a drawing, then it is stored under its hash and comes back byte for byte as a download', async () => {
    const { author, revisionId } = await calcTeam(ctx.app);
    const bytes = pdfBytes(3000);

    const res = await upload(
      author.session,
      revisionId,
      bytes,
      { kind: 'drawing', note: 'Released sheet 1' },
      '../../shaft ø45 "rev B".pdf',
    );
    const file = await author.session.get(`/api/attachments/${res.body.id}`).buffer(true);
    const list = await author.session.get(`/api/revisions/${revisionId}/attachments`);

    expect(res.status).toBe(201);
    expect(res.body).toEqual(
      expect.objectContaining({
        kind: 'drawing',
        mediaType: 'application/pdf',
        fileName: 'shaft ø45 rev B.pdf',
        sizeBytes: 3000,
        sha256: createHash('sha256').update(bytes).digest('hex'),
      }),
    );
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, bytes)).toBe(0);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toMatch(
      /^attachment; filename="shaft \?45 rev B\.pdf"; filename\*=UTF-8''shaft%20%C3%B845%20rev%20B\.pdf$/,
    );
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect(list.body).toEqual(
      expect.objectContaining({ canAdd: true, items: [expect.objectContaining({ id: res.body.id })] }),
    );
  });

  it.each([
    ['a Windows program named like a drawing', windowsProgram(), 'drawing.pdf', /Windows program/],
    ['a shell script named like a certificate', Buffer.from('#!/bin/sh\nrm -rf ~\n'), 'certificate.pdf', /script/],
    [
      'a Linux program',
      Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(200)]),
      'notes.txt',
      /not a recognised|Linux program/,
    ],
  ])(
    'when the file is %s, then it is refused by its content and nothing is stored',
    async (_what, bytes, name, reason) => {
      const { author, revisionId } = await calcTeam(ctx.app);

      const res = await upload(author.session, revisionId, bytes, { kind: 'drawing' }, name);

      expect(res.status).toBe(400);
      expect(res.body.fieldErrors.file[0]).toMatch(reason);
      expect(res.body.fieldErrors.file[0]).toMatch(/accepted: PDF/);
      expect(await Attachment.count({ where: { revisionId } })).toBe(0);
    },
  );

  it('when a PDF is cut short before its end-of-file marker, then it is refused as such and nothing is stored', async () => {
    const { author, revisionId } = await calcTeam(ctx.app);
    const whole = pdfBytes(4_000);
    const cut = whole.subarray(0, 3_000); // an interrupted copy: the header is there, the trailer and %%EOF are not

    const res = await upload(author.session, revisionId, cut, { kind: 'drawing' }, 'DRG-7 sheet 1.pdf');

    expect([res.status, Object.keys(res.body.fieldErrors)]).toEqual([400, ['file']]);
    expect(res.body.fieldErrors.file[0]).toMatch(/stops short of its end-of-file marker/);
    expect(await Attachment.count({ where: { revisionId } })).toBe(0);
    // The whole file is taken.
    expect((await upload(author.session, revisionId, whole, { kind: 'drawing' }, 'DRG-7 sheet 1.pdf')).status).toBe(
      201,
    );
  });

  it.each([
    [
      'a text file named .pdf, as a drawing',
      Buffer.from('just some notes\n'),
      'drawing.pdf',
      'drawing',
      /is named ".pdf" but its content is plain text/,
    ],
    [
      'a text file named .txt, as a drawing',
      Buffer.from('just some notes\n'),
      'notes.txt',
      'drawing',
      /is plain text, but a drawing is a PDF/,
    ],
    [
      'a DXF drawing, as a material certificate',
      Buffer.from('0\nSECTION\n2\nENTITIES\n0\nENDSEC\n0\nEOF\n'),
      'shaft.dxf',
      'material-certificate',
      /a material certificate is a PDF or a scanned image/,
    ],
  ])(
    'when the upload is %s, then its declared kind or name does not match its content and it is refused (400, file)',
    async (_what, bytes, name, kind, reason) => {
      const { author, revisionId } = await calcTeam(ctx.app);

      const res = await upload(author.session, revisionId, bytes, { kind }, name);

      expect(res.status).toBe(400);
      expect(res.body.fieldErrors.file[0]).toMatch(reason);
      expect(await Attachment.count({ where: { revisionId } })).toBe(0);
    },
  );

  it('when a plain text note is attached as "Other", then it is accepted and its size reads in bytes', async () => {
    const { author, revisionId } = await calcTeam(ctx.app);
    const res = await upload(
      author.session,
      revisionId,
      Buffer.from('belt pull from the tension calc\n'),
      { kind: 'other' },
      'notes.txt',
    );
    expect(res.status).toBe(201);
    expect(res.body).toEqual(expect.objectContaining({ mediaType: 'text/plain', sizeBytes: 32 }));
  });

  it('when the file is over the size limit, then it is refused with 413 and a message naming the limit', async () => {
    const { author, revisionId } = await calcTeam(ctx.app);

    const res = await upload(author.session, revisionId, pdfBytes(80_000), { kind: 'drawing' });

    expect(res.status).toBe(413);
    expect(res.body.message).toBe('file: is larger than the 51 kB limit; nothing was stored');
    expect(res.body.fieldErrors.file).toEqual(['is larger than the 51 kB limit']);
    expect(await Attachment.count({ where: { revisionId } })).toBe(0);
  });

  it('when the file or a valid kind is missing, then 400 names the field', async () => {
    const { author, revisionId } = await calcTeam(ctx.app);

    const noFile = await upload(author.session, revisionId, null, { kind: 'drawing' });
    const badKind = await upload(author.session, revisionId, pdfBytes(), { kind: 'photo' });
    const extraField = await upload(author.session, revisionId, pdfBytes(), { kind: 'drawing', owner: 'me' });

    expect(noFile.body.fieldErrors).toEqual({ file: ['is required: send the file as multipart form field "file"'] });
    expect(badKind.body.fieldErrors.kind[0]).toMatch(/must be one of drawing, material-certificate, other/);
    expect(extraField.body.fieldErrors).toEqual({ owner: ['is not an accepted field'] });
  });
});

describe('who may attach, and when', () => {
  it('when nobody is signed in, or the revision does not exist, or someone outside the review tries, then 401, 404 and 403', async () => {
    const { approver, revisionId } = await calcTeam(ctx.app);
    const { agent, token } = await anonymousAgent(ctx.app);

    const anonymous = await agent
      .post(`/api/revisions/${revisionId}/attachments`)
      .set('x-csrf-token', token)
      .field('kind', 'drawing');
    const missing = await upload(approver.session, 999_999_999, pdfBytes(), { kind: 'drawing' });
    const outsider = await upload(approver.session, revisionId, pdfBytes(), { kind: 'drawing' });

    expect([anonymous.status, missing.status, outsider.status]).toEqual([401, 404, 403]);
    expect((await approver.session.get('/api/attachments/999999999')).status).toBe(404);
  });

  it('when a checked item needs a certificate, then ticking it is refused until the checker attaches one', async () => {
    const { author, checker, revisionId } = await calcTeam(ctx.app);
    await sign(author.session, revisionId, 'authored', { withoutRequiredFiles: true });

    const refused = await checker.session.put(`/api/revisions/${revisionId}/manual-items/material-certificate`, {
      done: true,
      note: '',
    });
    const added = await upload(
      checker.session,
      revisionId,
      pdfBytes(),
      { kind: 'material-certificate' },
      'mill-cert.pdf',
    );
    const ticked = await checker.session.put(`/api/revisions/${revisionId}/manual-items/material-certificate`, {
      done: true,
      note: 'heat 4471',
    });

    expect(refused.status).toBe(409);
    expect(refused.body.message).toMatch(
      /needs a material certificate attached to revision .* before it can be ticked/,
    );
    expect(added.status).toBe(201);
    expect(ticked.status).toBe(200);
    expect(ticked.body.manualItems['material-certificate']).toEqual(expect.objectContaining({ done: true }));
  });

  it('when the revision is approved, then its attachments are read-only: no uploads, no removals', async () => {
    const { author, checker, approver, revisionId } = await calcTeam(ctx.app);
    const early = await upload(author.session, revisionId, pdfBytes(), { kind: 'other' }, 'notes.pdf');
    await sign(author.session, revisionId, 'authored');
    await tickAll(checker.session, revisionId);
    await sign(checker.session, revisionId, 'checked');
    await sign(approver.session, revisionId, 'approved');

    const late = await upload(author.session, revisionId, pdfBytes(), { kind: 'other' });
    const removal = await author.session.delete(`/api/attachments/${early.body.id}`);
    const list = await author.session.get(`/api/revisions/${revisionId}/attachments`);

    expect((await revisionOf(author.session, revisionId)).status).toBe('approved');
    expect(late.status).toBe(409);
    expect(late.body.message).toMatch(/is approved; its attachments are read-only/);
    expect(removal.status).toBe(409);
    expect(list.body.canAdd).toBe(false);
    expect(list.body.items.map((a: { id: number }) => a.id)).toContain(early.body.id);
  });

  it('when a co-editor attached a file to a draft, then its author may remove it before signing', async () => {
    const { author, checker, revisionId } = await calcTeam(ctx.app);
    const added = await upload(author.session, revisionId, pdfBytes(), { kind: 'other' });
    await Attachment.update(
      { uploadedBy: checker.user.id, uploadedByName: 'a co-editor' },
      { where: { id: added.body.id } },
    );

    expect((await author.session.delete(`/api/attachments/${added.body.id}`)).status).toBe(204);
    expect(await Attachment.count({ where: { revisionId } })).toBe(0);
  });

  it('when the uploader removes a file from a draft, then it is gone; someone else may not', async () => {
    const { author, checker, revisionId } = await calcTeam(ctx.app);
    const added = await upload(author.session, revisionId, pdfBytes(), { kind: 'other' });

    expect((await checker.session.delete(`/api/attachments/${added.body.id}`)).status).toBe(403);
    expect((await author.session.delete(`/api/attachments/${added.body.id}`)).status).toBe(204);
    expect(await Attachment.count({ where: { revisionId } })).toBe(0);
  });
});

describe('storage outage', () => {
  it('when object storage is unreachable, then the upload is a 503 with a plain message and no row is written', async () => {
    // Same database, storage pointed at a port nobody listens on.
    const down = createApp({ sequelize: ctx.sequelize, config: { ...ctx.config, S3_ENDPOINT: 'http://127.0.0.1:9' } });
    const { author, revisionId } = await calcTeam(down);

    const res = await upload(author.session, revisionId, pdfBytes(), { kind: 'drawing' });
    const rows = await Attachment.count({ where: { revisionId } });
    await closeApp(down);

    expect(res.status).toBe(503);
    expect(res.body.message).toMatch(/Attachment storage is unavailable.*nothing was lost/);
    expect(rows).toBe(0);
  });
});
