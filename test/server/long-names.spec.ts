import { randomUUID } from 'node:crypto';
import { signedInAs } from '../support/api-harness';
import { effectiveRuleSetId, fixtureInput, sign, tickAll } from '../support/calc-harness';
import { appWithTestS3 } from '../support/s3-app';
import { pdfBytes, upload } from '../support/upload-harness';
import { getBinary } from '../support/pack-harness';
import { readPdf } from '../support/pdf-harness';
import { MailOutbox } from '../../server/db/models';

// Whatever creation accepts must work in every later step: the longest project code, calc number,
// title and part reference the forms allow go through sign-off, mail, report and evidence pack.
const ctx = appWithTestS3();

describe('the longest names creation accepts', () => {
  it('when code, number, title and part reference are at their limits, then sign-off, mail, report and evidence pack all work', async () => {
    const admin = await signedInAs(ctx.app, ['admin', 'author'], 'long-admin');
    const [checker, approver, compliance] = await Promise.all([
      signedInAs(ctx.app, ['checker'], 'long-checker'),
      signedInAs(ctx.app, ['approver'], 'long-approver'),
      signedInAs(ctx.app, ['compliance'], 'long-compliance'),
    ]);
    const code = `L${randomUUID().replace(/-/g, '').toUpperCase()}`.slice(0, 32);
    const project = await admin.session.post('/api/projects', { code, name: 'P'.repeat(160), client: 'C'.repeat(160) });
    expect(project.status).toBe(201);
    const number = `N-${randomUUID().slice(0, 8)}-${'7'.repeat(40)}`.slice(0, 40);
    const title = `Long title ${'ø'.repeat(30)} ${'gear shaft '.repeat(20)}`.slice(0, 200);
    const created = await admin.session.post('/api/calcs', {
      projectId: project.body.id,
      number,
      title,
      partRef: 'D'.repeat(120),
      ruleSetId: await effectiveRuleSetId(),
      input: fixtureInput(),
    });
    expect(created.status).toBe(201);
    const revisionId = created.body.latest.id as number;
    await upload(admin.session, revisionId, pdfBytes(), { kind: 'drawing' }, `${'d'.repeat(200)}.pdf`);
    await upload(admin.session, revisionId, pdfBytes(), { kind: 'material-certificate' }, 'cert.pdf');

    const steps = [await sign(admin.session, revisionId, 'authored')];
    await tickAll(checker.session, revisionId);
    steps.push(
      await sign(checker.session, revisionId, 'checked'),
      await sign(approver.session, revisionId, 'approved'),
    );
    expect(steps.map((s) => [s.status, s.body.message])).toEqual([
      [200, undefined],
      [200, undefined],
      [200, undefined],
    ]);

    const mails = (await MailOutbox.findAll()).filter((m) => m.body.includes(number));
    expect(mails.length).toBeGreaterThan(0);
    for (const m of mails) {
      expect(m.subject.length).toBeLessThanOrEqual(250);
      expect(m.subject).toContain(number);
      expect(m.body).toContain(title);
    }

    const report = await getBinary(admin.session, `/api/revisions/${revisionId}/report.pdf`);
    expect(report.status).toBe(200);
    expect(readPdf(report.body as Buffer, 'long-names-report').text.replace(/\s+/g, '')).toContain(number);
    const pack = await getBinary(compliance.session, `/api/calcs/${created.body.id}/evidence.zip`);
    expect(pack.status).toBe(200);
    expect(pack.headers['content-disposition']).toMatch(/^attachment; filename="?evidence_[\w.-]+\.zip"?$/);
  });
});
