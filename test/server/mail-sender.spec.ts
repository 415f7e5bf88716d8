import { randomUUID } from 'node:crypto';
import { startTestApp, signedInAs, anonymousAgent } from '../support/api-harness';
import { startTestSmtp } from '../support/fake-servers';
import { closedPort, senderFor } from '../support/mail-harness';
import { MailOutbox } from '../../server/db/models';

// The outbox sender on its own: delivery once, backoff while the SMTP server is down, giving up
// after the last attempt, and two app instances sharing one outbox. Time is a clock the test moves.
const { app, sequelize } = startTestApp();
let smtp: Awaited<ReturnType<typeof startTestSmtp>>;
beforeAll(async () => {
  smtp = await startTestSmtp();
});
afterAll(async () => {
  await smtp.close();
  await sequelize.close();
});

async function queue(count = 1) {
  const recipient = `someone-${randomUUID().slice(0, 8)}@example.test`;
  const rows = await MailOutbox.bulkCreate(
    Array.from({ length: count }, (_, i) => ({
      event: 'submitted',
      recipient,
      subject: `Ready for check: test ${i}`,
      body: 'A calc waits for you.',
      nextAttemptAt: new Date(),
    })),
  );
  return { recipient, ids: rows.map((r) => r.id) };
}
const arrivedFor = (to: string) => smtp.messages.filter((m) => m.envelopeTo.includes(to));

describe('mail sender', () => {
  it('when the SMTP server is down, then the row waits with a doubling backoff and is delivered once it is back', async () => {
    const { recipient, ids } = await queue();
    let now = new Date();
    const down = senderFor(sequelize, await closedPort(), { clock: () => now });

    expect(await down.sender.runOnce({ ids })).toEqual({ sent: 0, retrying: 1, failed: 0 });
    const first = (await MailOutbox.findByPk(ids[0]))!;
    expect([first.status, first.attempts, first.nextAttemptAt.getTime() - now.getTime()]).toEqual([
      'pending',
      1,
      30_000,
    ]);
    expect(first.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(await down.sender.runOnce({ ids })).toEqual({ sent: 0, retrying: 0, failed: 0 });
    now = new Date(now.getTime() + 31_000);
    await down.sender.runOnce({ ids });
    const second = (await MailOutbox.findByPk(ids[0]))!;
    expect([second.attempts, second.nextAttemptAt.getTime() - now.getTime()]).toEqual([2, 60_000]);
    down.close();

    now = new Date(now.getTime() + 61_000);
    const up = senderFor(sequelize, smtp.port, { clock: () => now });
    expect(await up.sender.runOnce({ ids })).toEqual({ sent: 1, retrying: 0, failed: 0 });
    expect(await up.sender.runOnce({ ids })).toEqual({ sent: 0, retrying: 0, failed: 0 });
    up.close();
    expect(arrivedFor(recipient)).toHaveLength(1);
    expect((await MailOutbox.findByPk(ids[0]))!.status).toBe('sent');
  });

  it('when the last attempt fails, then the row is marked failed and never tried again', async () => {
    const { ids } = await queue();
    let now = new Date();
    const down = senderFor(sequelize, await closedPort(), { clock: () => now, maxAttempts: 2 });

    await down.sender.runOnce({ ids });
    now = new Date(now.getTime() + 3_600_000);
    expect(await down.sender.runOnce({ ids })).toEqual({ sent: 0, retrying: 0, failed: 1 });
    now = new Date(now.getTime() + 86_400_000);
    expect(await down.sender.runOnce({ ids })).toEqual({ sent: 0, retrying: 0, failed: 0 });
    down.close();

    expect((await MailOutbox.findByPk(ids[0]))!).toEqual(expect.objectContaining({ status: 'failed', attempts: 2 }));
  });

  // Each sender claims through its own pooled connection, so the database sees two claimers, as
  // with two instances (models are bound to one Sequelize per process, hence one pool here).
  it('when two senders work one outbox at once, then every row is delivered exactly once', async () => {
    const { recipient, ids } = await queue(8);
    const a = senderFor(sequelize, smtp.port);
    const b = senderFor(sequelize, smtp.port);

    const [ra, rb] = await Promise.all([a.sender.runOnce({ ids }), b.sender.runOnce({ ids })]);
    a.close();
    b.close();

    expect(ra.sent + rb.sent).toBe(8);
    expect(
      arrivedFor(recipient)
        .map((m) => m.subject)
        .sort(),
    ).toEqual(ids.map((_, i) => `Ready for check: test ${i}`).sort());
  });
});

describe('sent mail screen', () => {
  it('when an admin lists sent mail, then rows come newest first with status, and one opens with its body', async () => {
    const { ids } = await queue();
    const { session } = await signedInAs(app, ['admin']);

    const list = await session.get('/api/mail/sent?size=5');
    const one = await session.get(`/api/mail/sent/${ids[0]}`);

    expect(list.status).toBe(200);
    expect(list.body.items[0].id).toBeGreaterThanOrEqual(ids[0]);
    expect(list.body.items[0].body).toBeUndefined();
    expect(one.body).toEqual(
      expect.objectContaining({
        id: ids[0],
        status: 'pending',
        body: 'A calc waits for you.',
        messageId: expect.stringMatching(/^<tt-outbox-/),
      }),
    );
  });

  it('when an admin lists one kind of mail, then only mail of that kind comes back', async () => {
    await queue();
    const { session } = await signedInAs(app, ['admin']);
    const list = await session.get('/api/mail/sent?size=50&event=submitted');
    expect(list.status).toBe(200);
    expect(list.body.items.length).toBeGreaterThan(0);
    expect(new Set(list.body.items.map((m: { event: string }) => m.event))).toEqual(new Set(['submitted']));
  });

  it.each([['author'], ['checker'], ['compliance']] as const)(
    'when a %s asks for sent mail, then it is refused (403)',
    async (role) => {
      const { session } = await signedInAs(app, [role]);
      expect((await session.get('/api/mail/sent')).status).toBe(403);
    },
  );

  it('when nobody is signed in, or the query is wrong, or the mail does not exist, then 401, 400 and 404', async () => {
    const { agent } = await anonymousAgent(app);
    const { session } = await signedInAs(app, ['admin']);

    expect((await agent.get('/api/mail/sent')).status).toBe(401);
    const bad = await session.get('/api/mail/sent?status=lost');
    expect(bad.status).toBe(400);
    expect(bad.body.fieldErrors['query.status']).toEqual(['must be pending, sent or failed']);
    const kind = await session.get('/api/mail/sent?event=gossip');
    expect([kind.status, kind.body.fieldErrors['query.event']]).toEqual([400, ['is not a kind of mail']]);
    expect((await session.get('/api/mail/sent/999999999')).status).toBe(404);
  });

  it('when a mail has non-ASCII words and long lines, then a mail client (mailparser) reads back exactly what was queued', async () => {
    const recipient = `reader-${randomUUID().slice(0, 8)}@example.test`;
    const subject = 'Ready for check: KFD-Ø50 “Förderwelle” – rev B → approved?';
    const body = `Torque 1 250 N·m, τ = 41.6 MPa; ${'a long line that a sender must fold or encode '.repeat(6)}\nSecond line: Größe ≥ 50 mm.`;
    const [row] = await MailOutbox.bulkCreate([
      { event: 'submitted', recipient, subject, body, nextAttemptAt: new Date() },
    ]);
    const { sender, close } = senderFor(sequelize, smtp.port);

    await sender.runOnce({ ids: [row.id] });
    close();

    const [mail] = arrivedFor(recipient);
    expect(mail.subject).toBe(subject);
    expect(mail.text.trim()).toBe(body);
    expect(mail.to).toContain(recipient);
    expect(mail.headers['content-type']).toMatch(/charset=utf-8/i);
    expect(mail.attachments).toEqual([]);
  });
});
