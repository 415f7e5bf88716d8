import type { Response } from 'supertest';
import { Op } from 'sequelize';
import { AuditEvent, Project, Revision } from '../../server/db/models';
import { startTestApp, expectStatus, type Session } from '../support/api-harness';
import { advanceTo, fixtureInput, revisionOf, sign } from '../support/calc-harness';
import { lastAuditId } from '../support/audit-harness';
import { findingsTeam, returnedWithFindingOf } from '../support/findings-harness';
import { pdfBytes, upload } from '../support/upload-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

async function archiveProjectOf(revisionId: number): Promise<void> {
  const revision = await Revision.findByPk(revisionId, { include: ['Calc'] });
  const projectId = (revision as Revision & { Calc: { projectId: number } }).Calc.projectId;
  await Project.update({ status: 'archived' }, { where: { id: projectId } });
}

/**
 * Audit entries since `since` about this revision or its calc. Other specs run beside this one and append
 * entries of their own, so "nothing new in the whole trail" cannot be asked.
 */
async function auditAbout(revisionId: number, since: number): Promise<number> {
  const { calcId } = (await Revision.findByPk(revisionId))!;
  return AuditEvent.count({
    where: {
      id: { [Op.gt]: since },
      [Op.or]: [
        { entityType: 'Revision', entityId: String(revisionId) },
        { entityType: 'Calc', entityId: String(calcId) },
        { payload: { [Op.like]: `%"revisionId":${revisionId}%` } },
        { payload: { [Op.like]: `%"calcId":${calcId}%` } },
      ],
    },
  });
}

/** Refused with the archive named, and nothing about the revision or its audit trail changed. */
async function expectRefused(write: () => Promise<Response>, reader: Session, revisionId: number): Promise<void> {
  const before = await revisionOf(reader, revisionId);
  const auditBefore = await lastAuditId();
  const res = await write();
  expect(res.status).toBe(409);
  expect(res.body).toEqual({
    code: 'archived',
    message: expect.stringMatching(/is archived: its calcs are read-only/),
  });
  expect(await revisionOf(reader, revisionId)).toEqual(before);
  expect(await auditAbout(revisionId, auditBefore)).toBe(0);
}

describe('an archived project is read-only', () => {
  it('when its draft is saved, signed, withdrawn or given a file, then each is refused', async () => {
    const t = await findingsTeam(app);
    const { lockVersion } = await revisionOf(t.author.session, t.revisionId);
    await archiveProjectOf(t.revisionId);
    const a = t.author.session;

    await expectRefused(
      () => a.put(`/api/revisions/${t.revisionId}`, { input: fixtureInput(), lockVersion }),
      a,
      t.revisionId,
    );
    await expectRefused(() => sign(a, t.revisionId, 'authored'), a, t.revisionId);
    await expectRefused(
      () => a.post(`/api/revisions/${t.revisionId}/withdraw`, { reason: 'No longer needed', lockVersion }),
      a,
      t.revisionId,
    );
    await expectRefused(() => upload(a, t.revisionId, pdfBytes(), { kind: 'drawing', note: '' }), a, t.revisionId);
  });

  it('when its calc is in check, then ticking, raising a finding, returning and signing as checked are refused', async () => {
    const t = await findingsTeam(app);
    await advanceTo('in_check', t.sessions, t.revisionId);
    const { lockVersion, checklist } = await revisionOf(t.checker.session, t.revisionId);
    await archiveProjectOf(t.revisionId);
    const c = t.checker.session;
    const item = checklist.manual[0].id as string;

    await expectRefused(
      () => c.put(`/api/revisions/${t.revisionId}/manual-items/${item}`, { done: true, note: '' }),
      c,
      t.revisionId,
    );
    await expectRefused(
      () => c.post(`/api/revisions/${t.revisionId}/findings`, { text: 'Name the source of Kt' }),
      c,
      t.revisionId,
    );
    await expectRefused(
      () => c.post(`/api/revisions/${t.revisionId}/return`, { reason: 'Needs a source', lockVersion }),
      c,
      t.revisionId,
    );
    await expectRefused(() => sign(c, t.revisionId, 'checked'), c, t.revisionId);
  });

  it('when its calc was returned with a finding, then answering and closing the finding are refused', async () => {
    const t = await returnedWithFindingOf(app);
    await archiveProjectOf(t.revisionId);

    await expectRefused(
      () => t.author.session.post(`/api/findings/${t.findingId}/answer`, { answer: 'Chart added' }),
      t.author.session,
      t.revisionId,
    );
    await expectRefused(
      () => t.checker.session.post(`/api/findings/${t.findingId}/close`),
      t.checker.session,
      t.revisionId,
    );
  });

  it('when its calc is checked, then signing as approver is refused', async () => {
    const t = await findingsTeam(app);
    await advanceTo('checked', t.sessions, t.revisionId);
    await archiveProjectOf(t.revisionId);
    await expectRefused(() => sign(t.approver.session, t.revisionId, 'approved'), t.approver.session, t.revisionId);
  });

  it("when an approved calc's project is archived, then no new revision can be started", async () => {
    const t = await findingsTeam(app);
    await advanceTo('approved', t.sessions, t.revisionId);
    const { calcId } = await revisionOf(t.author.session, t.revisionId);
    await archiveProjectOf(t.revisionId);

    await expectRefused(
      () => t.author.session.post(`/api/calcs/${calcId}/revisions`, { reasonForChange: 'Longer keyway' }),
      t.author.session,
      t.revisionId,
    );
  });

  it('when a project is archived, then its calcs are still readable and lists mark them', async () => {
    const t = await findingsTeam(app);
    const { calcId } = await revisionOf(t.author.session, t.revisionId);
    await archiveProjectOf(t.revisionId);

    const calc = expectStatus(await t.author.session.get(`/api/calcs/${calcId}`), 200, 'read calc');
    const list = expectStatus(await t.author.session.get(`/api/calcs?projectId=${calc.body.projectId}`), 200, 'list');

    const files = expectStatus(
      await t.author.session.get(`/api/revisions/${t.revisionId}/attachments`),
      200,
      'attachments',
    );

    expect(calc.body.projectArchived).toBe(true);
    expect(list.body.items.map((c: { projectArchived: boolean }) => c.projectArchived)).toEqual([true]);
    expect(files.body.canAdd).toBe(false);
  });
});
