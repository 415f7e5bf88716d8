import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { Attachment, Project, Revision } from '../../server/db/models';
import { loadRevision } from '../../server/calcs/calc-access';
import { refreshAfterAttachmentChange } from '../../server/workflow/signed-content';
import { runTransaction } from '../../server/db/transaction';
import { TEST_PASSWORD, uniqueCode, expectStatus, person, type Session } from './api-harness';
import { fixtureInput, revisionOf, sign, tickAll } from './calc-harness';
import { replaceStandard, standardWithoutAttachments } from './standard-harness';

const DAY = 86_400_000;
export const today = () => new Date().toISOString().slice(0, 10);
export const daysAgo = (n: number) => new Date(Date.now() - n * DAY).toISOString().slice(0, 10);

/** Moves a revision's recorded times (constructed data: the signals read these columns). */
export async function setTimes(revisionId: number, times: { submittedAt?: Date; checkedAt?: Date; approvedAt?: Date }) {
  await Revision.update(times, { where: { id: revisionId } });
}

/** A file added after the check signature, as an approver's late evidence would be (row only, no bytes). */
export async function addLateFile(revisionId: number, uploadedBy: number) {
  await Attachment.create({
    revisionId,
    kind: 'other',
    fileName: 'late-note.pdf',
    mediaType: 'application/pdf',
    sizeBytes: 5,
    sha256: '1'.repeat(64),
    storageKey: 'test-fixture/no-bytes',
    uploadedBy,
    uploadedByName: 'test harness',
  });
  await runTransaction(Revision.sequelize!, async (t) =>
    refreshAfterAttachmentChange(await loadRevision(revisionId, t), t),
  );
}

/**
 * One project with three calcs under a test standard: A1 and A2 by author A, both checked by
 * checker 1 without findings; B1 by author B, checked by checker 2 after a finding. The approver
 * is refused three times on B1 for a wrong password, checker 2 once.
 */
export async function healthScenario(app: Express) {
  const standard = await standardWithoutAttachments();
  const project = await Project.create({ code: uniqueCode('RH'), name: 'Review health test', createdBy: null });
  const [authorA, authorB, checker1, checker2, approver] = await Promise.all(
    [
      ['author', 'author-a'],
      ['author', 'author-b'],
      ['checker', 'checker-1'],
      ['checker', 'checker-2'],
      ['approver', 'approver'],
    ].map(([role, label]) => person(app, [role as 'author'], label)),
  );
  const create = async (author: Session) =>
    expectStatus(
      await author.post('/api/calcs', {
        projectId: project.id,
        number: `RH-${randomUUID().slice(0, 6)}`,
        title: 'Review health shaft',
        partRef: 'DRG-RH',
        ruleSetId: standard.id,
        input: fixtureInput(),
      }),
      201,
      'create',
    ).body.latest.id as number;
  const check = async (checker: Session, id: number) => {
    await tickAll(checker, id);
    expectStatus(await sign(checker, id, 'checked'), 200, 'check');
  };
  const [a1, a2, b1] = [await create(authorA.session), await create(authorA.session), await create(authorB.session)];
  for (const id of [a1, a2]) expectStatus(await sign(authorA.session, id, 'authored'), 200, 'submit');
  expectStatus(await sign(authorB.session, b1, 'authored'), 200, 'submit');
  await check(checker1.session, a1);
  await check(checker1.session, a2);
  // A return is a finding by the checker; the author answers it and submits again, the checker closes it.
  const returned = expectStatus(
    await checker2.session.post(`/api/revisions/${b1}/return`, {
      reason: 'State the keyseat depth used',
      lockVersion: (await revisionOf(checker2.session, b1)).lockVersion,
    }),
    200,
    'return',
  ).body;
  const findingId = returned.findings[0].id as number;
  expectStatus(
    await authorB.session.post(`/api/findings/${findingId}/answer`, { answer: 'Depth is 5 mm, see the drawing' }),
    200,
    'answer',
  );
  expectStatus(await sign(authorB.session, b1, 'authored'), 200, 'submit again');
  expectStatus(await checker2.session.post(`/api/findings/${findingId}/close`), 200, 'close');
  const wrong = (s: Session, id: number, meaning: string) =>
    s.post(`/api/revisions/${id}/sign`, {
      password: `${TEST_PASSWORD}!`,
      meaning,
      idempotencyKey: randomUUID(),
      lockVersion: 0,
    });
  await tickAll(checker2.session, b1);
  expectStatus(await wrong(checker2.session, b1, 'checked'), 400, 'refused check');
  await check(checker2.session, b1);
  await addLateFile(a1, approver.user.id);
  for (let i = 0; i < 3; i++) expectStatus(await wrong(approver.session, b1, 'approved'), 400, 'refused approval');
  for (const id of [a1, a2, b1]) expectStatus(await sign(approver.session, id, 'approved'), 200, 'approve');
  const now = Date.now();
  await setTimes(a1, {
    submittedAt: new Date(now - 3 * DAY - 10_000),
    checkedAt: new Date(now - 3 * DAY),
    approvedAt: new Date(now - 2 * DAY),
  });
  await setTimes(a2, {
    submittedAt: new Date(now - 70 * DAY),
    checkedAt: new Date(now - 61 * DAY),
    approvedAt: new Date(now - 60 * DAY),
  });
  await setTimes(b1, {
    submittedAt: new Date(now - 50 * DAY),
    checkedAt: new Date(now - 46 * DAY),
    approvedAt: new Date(now - 45 * DAY),
  });
  // The day v2 took effect, kept for assertions: the day of `now`, so that a1's approval is 2 days before it (1 to 2
  // days by the clock) even when the run passes midnight (UTC) between setting the times and this line.
  const v2On = new Date(now).toISOString().slice(0, 10);
  await replaceStandard(standard, v2On);
  const calcOf = async (id: number) => (await revisionOf(authorA.session, id)).calcId as number;
  return {
    project: { id: project.id, code: project.code },
    standard: { ...standard, v2On },
    authorA,
    authorB,
    checker1,
    checker2,
    approver,
    revisions: { a1, a2, b1 },
    calcs: { a1: await calcOf(a1), a2: await calcOf(a2), b1: await calcOf(b1) },
  };
}
