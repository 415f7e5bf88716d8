import { randomUUID } from 'node:crypto';
import { createTestProject, startTestApp, person, type Session } from '../support/api-harness';
import { auditOf } from '../support/audit-harness';
import { createCalc, fixtureInput, revisionOf, sign, tickAll, workflowStandardId } from '../support/calc-harness';
import { pdfBytes, upload } from '../support/upload-harness';
import { verifyAuditChain } from '../../server/audit/audit.service';
import { Attachment, Calc, Signature } from '../../server/db/models';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Res = { status: number; body: any };

/** Saves until stored, rebasing on each 409 like the client does; returns every answer it got. */
async function saveRebasing(s: Session, revisionId: number, mark: string, seen: Res[]): Promise<number> {
  let base = await revisionOf(s, revisionId);
  for (;;) {
    const res = await s.put(`/api/revisions/${revisionId}`, {
      input: { ...base.input, title: `${base.input.title} ${mark}` },
      lockVersion: base.lockVersion,
    });
    seen.push(res);
    if (res.status === 200) return res.body.lockVersion;
    if (res.status !== 409 || !res.body.current) return -1;
    base = res.body.current;
  }
}

describe('many writers at once', () => {
  it('when saves, uploads, calc creations, ticks and signatures run concurrently, then none is answered 500 and every acknowledged write is stored', async () => {
    // Arrange: three authors with two drafts each, and two revisions waiting for a checker.
    const authors = await Promise.all([1, 2, 3].map((i) => person(app, ['author'], `w${i}`)));
    const drafts = await Promise.all(
      authors.flatMap((a) => [createCalc(a.session), createCalc(a.session)]).map(async (p) => ({ ...(await p) })),
    );
    const submitter = await person(app, ['author'], 'sub');
    const checker = await person(app, ['checker']);
    const inCheck = [await createCalc(submitter.session), await createCalc(submitter.session)];
    for (const c of inCheck) expect((await sign(submitter.session, c.revisionId, 'authored')).status).toBe(200);
    const toSubmit = await createCalc(submitter.session);
    const project = await createTestProject();
    const ruleSetId = await workflowStandardId();
    const seen: Res[] = [];
    const track = async (p: Promise<Res>) => {
      const r = await p;
      seen.push(r);
      return r;
    };

    // Act
    const saves = drafts.flatMap((d, i) =>
      [1, 2, 3].map((n) => saveRebasing(authors[Math.floor(i / 2)].session, d.revisionId, `[d${i}s${n}]`, seen)),
    );
    const uploads = drafts.map((d, i) =>
      track(
        upload(
          authors[Math.floor(i / 2)].session,
          d.revisionId,
          pdfBytes(300, `file ${i}`),
          { kind: 'drawing', note: '' },
          `drawing-${i}.pdf`,
        ),
      ),
    );
    const creations = authors.flatMap((a) =>
      [1, 2].map(() =>
        track(
          a.session.post('/api/calcs', {
            projectId: project.id,
            number: `W-${randomUUID().slice(0, 8)}`,
            title: 'Concurrent head shaft',
            partRef: 'DRG-W',
            ruleSetId,
            input: fixtureInput(),
          }),
        ),
      ),
    );
    const reviews = inCheck.map(async (c) => {
      await tickAll(checker.session, c.revisionId);
      return track(sign(checker.session, c.revisionId, 'checked'));
    });
    const submit = track(sign(submitter.session, toSubmit.revisionId, 'authored'));
    const [savedVersions, uploaded, created, reviewed, submitted] = await Promise.all([
      Promise.all(saves),
      Promise.all(uploads),
      Promise.all(creations),
      Promise.all(reviews),
      submit,
    ]);

    // Assert: no 5xx anywhere, and each write the server acknowledged is there.
    expect(seen.filter((r) => r.status >= 500).map((r) => r.body)).toEqual([]);
    expect(savedVersions.filter((v) => v < 0)).toEqual([]);
    for (const [i, d] of drafts.entries()) {
      const stored = await revisionOf(authors[Math.floor(i / 2)].session, d.revisionId);
      for (const n of [1, 2, 3]) expect(stored.input.title).toContain(`[d${i}s${n}]`);
      expect((await auditOf('Revision', d.revisionId)).filter((e) => e.action === 'revision.saved')).toHaveLength(3);
    }
    expect(uploaded.map((r) => r.status)).toEqual(drafts.map(() => 201));
    expect(await Attachment.count({ where: { id: uploaded.map((r) => r.body.id) } })).toBe(drafts.length);
    expect(created.map((r) => r.status)).toEqual(created.map(() => 201));
    expect(await Calc.count({ where: { projectId: project.id } })).toBe(created.length);
    expect([...reviewed, submitted].map((r) => r.status)).toEqual([200, 200, 200]);
    expect(
      await Signature.count({ where: { revisionId: [...inCheck.map((c) => c.revisionId), toSubmit.revisionId] } }),
    ).toBe(5);
    expect((await verifyAuditChain()).ok).toBe(true);
  });
});
