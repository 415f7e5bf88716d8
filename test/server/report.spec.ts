import { calcTeam, revisionOf, sign, tickAll } from '../support/calc-harness';
import { appWithTestS3 } from '../support/s3-app';
import { pdfBytes, upload } from '../support/upload-harness';
import { fontsOf, readPdf } from '../support/pdf-harness';
import { returnedWithFindingOf } from '../support/findings-harness';

// The calc report read back the way a reader's tools see it: Poppler parses the PDF and
// extracts its text; page one is also rendered to artifacts/reports/ for a person to look at.
const ctx = appWithTestS3({ ORG_NAME: 'Kestrel Fen Drives' });

const getPdf = (session: { agent: { get: (u: string) => import('supertest').Test } }, id: number) =>
  session.agent
    .get(`/api/revisions/${id}/report.pdf`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });

describe('calc report', () => {
  it('when a draft is printed, then the PDF parses and carries the calc number, verdict, hash, DRAFT mark and caution', async () => {
    const { author, calc, revisionId } = await calcTeam(ctx.app);
    await upload(author.session, revisionId, pdfBytes(), { kind: 'drawing' }, 'DRG-1 sheet 1.pdf');
    const revision = await revisionOf(author.session, revisionId);

    const res = await getPdf(author.session, revisionId);
    const { text, pages } = readPdf(res.body as Buffer, 'draft-report');
    const flat = text.replace(/\s+/g, ' ');

    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?[\w.-]+\.pdf"?$/);
    expect(pages).toBeGreaterThanOrEqual(3);
    expect(flat).toContain(calc.number);
    expect(flat).toContain(revision.contentHash);
    expect(flat).toMatch(revision.verdict === 'compliant' ? /Compliant/ : /Not compliant/);
    expect(flat).toContain('DRAFT · NOT FOR CONSTRUCTION');
    expect(flat).toContain(
      'Results support, never replace, the judgement of a qualified engineer; local codes and licensed practice govern.',
    );
    expect(flat).toMatch(/τmax/);
    // Methods are named in words, never by code keys (issue 13, item 18).
    expect(flat).toContain('Torque diagram');
    expect(flat).not.toMatch(/torqueDiagram|notchSensitivity|goodman \(1\)|Kf \(1\)/);
    // Headline figures carry the outcome of the clause that judges them (issue 13, item 10).
    expect(flat).toMatch(/Lowest yield safety n_y [\d.]+ (?:[A-Z·] )*meets min [\d.]+ \(§5\.[12]\)/);
    expect(flat).toContain('DRG-1 sheet 1.pdf');
    expect(fontsOf(res.body as Buffer)).toMatch(/\+DejaVuSans\s+CID TrueType\s+Identity-H\s+yes yes yes/);
  });

  it('when an approved revision is printed, then it has no draft mark and lists three valid signatures', async () => {
    const { author, checker, approver, calc, revisionId } = await calcTeam(ctx.app);
    await sign(author.session, revisionId, 'authored');
    await tickAll(checker.session, revisionId);
    await sign(checker.session, revisionId, 'checked');
    await sign(approver.session, revisionId, 'approved');

    const res = await getPdf(checker.session, revisionId);
    const flat = readPdf(res.body as Buffer, 'approved-report').text.replace(/\s+/g, ' ');

    expect(flat).toContain(calc.number);
    expect(flat).not.toContain('NOT FOR CONSTRUCTION');
    expect(flat).toContain('APPROVED');
    expect(flat.match(/VALID: matches/g)).toHaveLength(3);
  });

  it('when a finding is on the revision, then the report numbers it as the screen does (F and its id)', async () => {
    const t = await returnedWithFindingOf(ctx.app);
    const { text } = readPdf((await getPdf(t.author.session, t.revisionId)).body as Buffer);
    const findings = text.replace(/\s+/g, ' ').split('Findings and answers')[1];
    // The table header may be extracted before or between the cells; what matters is the row's number.
    expect(findings).toMatch(
      new RegExp(`^( [A-Z·])* No\\. .*?\\bF${t.findingId} (Finding )?Name the chart behind the keyseat`),
    );
    expect(findings).not.toMatch(/\b1 Name the chart behind the keyseat/);
  });

  it('when the revision does not exist, the id is not a number, or nobody is signed in, then 404, 400 and 401', async () => {
    const { author } = await calcTeam(ctx.app);

    expect((await author.session.get('/api/revisions/999999999/report.pdf')).status).toBe(404);
    const bad = await author.session.get('/api/revisions/abc/report.pdf');
    expect(bad.status).toBe(400);
    expect(bad.body.fieldErrors['params.id']).toBeDefined();
  });
});
