import { TEST_PASSWORD, startTestApp, expectStatus, person } from '../support/api-harness';
import { advanceTo, calcTeam, createCalc, revisionOf, sign, tickAll } from '../support/calc-harness';
import { testStandard, withParameter } from '../support/standard-harness';
import { startTestSmtp } from '../support/fake-servers';
import { emailsOf, outboxFor, senderFor } from '../support/mail-harness';

// Hand-over mail end to end: the workflow writes outbox rows, the sender delivers them over SMTP
// to the fake server, and the test reads what arrived there.
const { app, sequelize } = startTestApp();
let smtp: Awaited<ReturnType<typeof startTestSmtp>>;
beforeAll(async () => {
  smtp = await startTestSmtp();
});
afterAll(async () => {
  await smtp.close();
  await sequelize.close();
});

async function deliverTo(addresses: string[]) {
  const { sender, close } = senderFor(sequelize, smtp.port);
  const ids = (await outboxFor(addresses)).filter((r) => r.status === 'pending').map((r) => r.id);
  await sender.runOnce({ ids });
  close();
  return smtp.messages.filter((m) => m.envelopeTo.some((to) => addresses.includes(to)));
}

async function returnAndResubmit(team: Awaited<ReturnType<typeof calcTeam>>) {
  const { author, checker, revisionId } = team;
  const r = await revisionOf(checker.session, revisionId);
  await checker.session.post(`/api/revisions/${revisionId}/return`, {
    reason: 'Use the certified Sy for 1045 CD',
    lockVersion: r.lockVersion,
  });
  const finding = (await revisionOf(author.session, revisionId)).findings[0];
  await author.session.post(`/api/findings/${finding.id}/answer`, { answer: 'Sy from the mill certificate, 530 MPa' });
  const resubmitted = await sign(author.session, revisionId, 'authored');
  await checker.session.post(`/api/findings/${finding.id}/close`, {});
  return resubmitted;
}

describe('hand-over mail', () => {
  it('when a calc is submitted, returned, resubmitted, checked and approved, then each mail reaches the right people', async () => {
    const team = await calcTeam(app);
    const [authorMail, checkerMail, approverMail] = await emailsOf(
      team.author.user.id,
      team.checker.user.id,
      team.approver.user.id,
    );

    expect((await sign(team.author.session, team.revisionId, 'authored')).status).toBe(200);
    expect((await returnAndResubmit(team)).status).toBe(200);
    await tickAll(team.checker.session, team.revisionId);
    expect((await sign(team.checker.session, team.revisionId, 'checked')).status).toBe(200);
    expect((await sign(team.approver.session, team.revisionId, 'approved')).status).toBe(200);
    const received = await deliverTo([authorMail, checkerMail, approverMail]);

    // Approvers are all told of every checked calc, and other specs run beside this one: count this calc's mail (its
    // project's code is unique and in every subject; calc numbers are unique only within a project).
    const subjectsTo = (to: string) =>
      received
        .filter((m) => m.envelopeTo.includes(to) && m.subject.includes(team.project.code))
        .map((m) => m.subject.split(':')[0]);
    expect(subjectsTo(checkerMail)).toEqual(['Ready for check', 'Ready for check']);
    expect(subjectsTo(authorMail)).toEqual(['Returned with findings', 'Approved']);
    expect(subjectsTo(approverMail)).toEqual(['Ready for approval']);
    const returned = received.find((m) => m.subject.startsWith('Returned'))!;
    expect(returned.text).toContain(`/calcs/${team.calc.id}`);
    expect(returned.text).toContain('Use the certified Sy');
    expect(returned.text).toMatch(/Test checker/);
    expect(returned.text).toMatch(/never replace, the judgement of a qualified engineer/);
    expect(returned.headers['message-id']).toMatch(/^<tt-outbox-\d+-\d+@kestrelfen\.example>$/);
  });

  it('when the author opts out of approval mail, then approving queues none for them but the others still get theirs', async () => {
    const team = await calcTeam(app);
    const [authorMail, approverMail] = await emailsOf(team.author.user.id, team.approver.user.id);
    const saved = await team.author.session.put('/api/mail/preferences', { preferences: { approved: false } });
    expect(saved.status).toBe(200);
    expect(saved.body.find((p: { event: string }) => p.event === 'approved')).toEqual(
      expect.objectContaining({ enabled: false, appliesToYou: true }),
    );

    await sign(team.author.session, team.revisionId, 'authored');
    await tickAll(team.checker.session, team.revisionId);
    await sign(team.checker.session, team.revisionId, 'checked');
    await sign(team.approver.session, team.revisionId, 'approved');

    // Approvers are told of every checked calc, and other specs run beside this one: count this calc's mail.
    const about = async (to: string) =>
      (await outboxFor([to])).filter((r) => r.subject.includes(team.project.code)).map((r) => r.event);
    expect(await about(authorMail)).toEqual([]);
    expect(await about(approverMail)).toEqual(['checked']);
  });

  it('when preferences name an unknown event or a non-boolean, then it is a 400 naming the field', async () => {
    const { author } = await calcTeam(app);

    const unknown = await author.session.put('/api/mail/preferences', { preferences: { gossip: true } });
    const notBoolean = await author.session.put('/api/mail/preferences', { preferences: { approved: 'sometimes' } });

    expect(unknown.status).toBe(400);
    expect(JSON.stringify(unknown.body.fieldErrors)).toMatch(/gossip|not a mail event/);
    expect(notBoolean.status).toBe(400);
    expect(notBoolean.body.fieldErrors['preferences.approved']).toEqual(['must be true or false']);
  });

  it('when a new version of a standard makes an approved calc fail, then every compliance person is told, with who and a link', async () => {
    const team = await calcTeam(app);
    const standard = await testStandard();
    const { revisionId } = await createCalc(team.author.session, { ruleSetId: standard.id });
    await advanceTo(
      'approved',
      { author: team.author.session, checker: team.checker.session, approver: team.approver.session },
      revisionId,
    );
    const [drafter, confirmer] = [
      await person(app, ['compliance'], 'drafter'),
      await person(app, ['compliance'], 'confirmer'),
    ];
    const draft = expectStatus(
      await drafter.session.post('/api/rule-sets', { fromId: standard.id }),
      201,
      'draft',
    ).body;
    const stricter = {
      ...withParameter(draft.document, 'minYieldSafety', 50),
      changeSummary: 'Yield safety raised for a test',
    };
    const saved = expectStatus(
      await drafter.session.put(`/api/rule-sets/${draft.id}`, { document: stricter, lockVersion: draft.lockVersion }),
      200,
      'save',
    ).body;
    const proposed = expectStatus(
      await drafter.session.post(`/api/rule-sets/${draft.id}/propose`, {
        effectiveDate: '2026-01-01',
        lockVersion: saved.lockVersion,
      }),
      200,
      'propose',
    ).body;

    expectStatus(
      await confirmer.session.post(`/api/rule-sets/${draft.id}/confirm`, {
        password: TEST_PASSWORD,
        lockVersion: proposed.lockVersion,
      }),
      200,
      'confirm',
    );
    const received = await deliverTo([drafter.email, confirmer.email, (await emailsOf(team.author.user.id))[0]]);

    // Every compliance person hears of every standard whose new version changes a verdict, so other spec files'
    // standards can mail the drafter and the confirmer while this runs; only the mail about this standard is judged.
    const impact = received.filter(
      (m) => m.headers['x-torquetrail-event'] === 'impact' && m.subject.startsWith(`${standard.code} v2 `),
    );
    expect(impact.flatMap((m) => m.envelopeTo).sort()).toEqual([drafter.email, confirmer.email].sort());
    expect(impact[0].subject).toMatch(new RegExp(`^${standard.code} v2 changes the verdict of \\d+ approved calc`));
    expect(impact[0].text).toContain(`confirmed by ${confirmer.displayName}`);
    expect(impact[0].text).toContain(`/rule-sets/${draft.id}`);
  });
});
