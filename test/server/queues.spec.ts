import { startTestApp, expectStatus, person, type Session } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, sign, tickAll, type Team } from '../support/calc-harness';
import type { Role } from '../../shared/authz/roles';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type QueueKey = 'my-drafts' | 'returned-to-me' | 'awaiting-my-check' | 'awaiting-my-approval';

interface QueuePage {
  key: QueueKey;
  items: { revisionId: number }[];
  next: string | null;
}

/**
 * Every revision in each of this person's queues, following the cursor to the end. The checkers' and approvers' queues
 * hold every independent calc waiting in the shared database, oldest first, and other spec files fill them while this
 * one runs: a calc just submitted may lie beyond the first page.
 */
async function queues(s: Session): Promise<Record<string, number[]>> {
  const res = expectStatus(await s.get('/api/dashboard/queues?size=500'), 200, 'queues');
  const all: Record<string, number[]> = {};
  for (let page of res.body as QueuePage[]) {
    all[page.key] = page.items.map((i) => i.revisionId);
    while (page.next) {
      const more = await s.get(`/api/dashboard/queues/${page.key}?size=500&after=${page.next}`);
      page = expectStatus(more, 200, `queue ${page.key}`).body;
      all[page.key].push(...page.items.map((i) => i.revisionId));
    }
  }
  return all;
}

async function team(authorRoles: Role[] = ['author']) {
  const author = await person(app, authorRoles, 'author');
  const checker = await person(app, ['checker']);
  const approver = await person(app, ['approver']);
  const sessions: Team = { author: author.session, checker: checker.session, approver: approver.session };
  return { author, checker, approver, sessions, ...(await createCalc(author.session)) };
}

describe('which queues a person has', () => {
  it.each([
    [['author'], ['my-drafts', 'returned-to-me']],
    [['checker'], ['awaiting-my-check']],
    [['approver'], ['awaiting-my-approval']],
    [['compliance'], []],
    [['admin'], []],
    [
      ['author', 'checker'],
      ['my-drafts', 'returned-to-me', 'awaiting-my-check'],
    ],
  ] as [Role[], QueueKey[]][])(
    'when someone with the roles %j opens their queues, then they get %j',
    async (roles, keys) => {
      // Arrange
      const someone = await person(app, roles);

      // Act
      const res = await someone.session.get('/api/dashboard/queues');

      // Assert
      expect(res.status).toBe(200);
      expect(res.body.map((q: { key: string }) => q.key)).toEqual(keys);
    },
  );
});

describe("the author's queues", () => {
  it("when an author has a draft, then it is in their drafts, not in another author's, and leaves once submitted", async () => {
    // Arrange
    const t = await team();
    const other = await person(app, ['author'], 'other');

    // Act
    const mine = await queues(t.author.session);
    const theirs = await queues(other.session);
    await advanceTo('in_check', t.sessions, t.revisionId);
    const afterSubmit = await queues(t.author.session);

    // Assert
    expect(mine['my-drafts']).toContain(t.revisionId);
    expect(theirs['my-drafts']).not.toContain(t.revisionId);
    expect(afterSubmit['my-drafts']).not.toContain(t.revisionId);
  });

  it("when a calc is returned, then it waits in its author's returned queue and not in their drafts", async () => {
    // Arrange
    const t = await team();
    await advanceTo('in_check', t.sessions, t.revisionId);

    // Act
    await t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
      reason: 'Missing fatigue data',
      lockVersion: (await revisionOf(t.author.session, t.revisionId)).lockVersion,
    });

    // Assert
    const q = await queues(t.author.session);
    expect(q['returned-to-me']).toContain(t.revisionId);
    expect(q['my-drafts']).not.toContain(t.revisionId);
  });
});

describe('queue pages', () => {
  it('when an author has three drafts and a returned calc, then each queue counts its own, oldest first, a page at a time', async () => {
    // Arrange: drafts made one after another (each waits since it was made), then the first submitted and returned
    const t = await team();
    const drafts = [(await createCalc(t.author.session)).revisionId, (await createCalc(t.author.session)).revisionId];
    drafts.push((await createCalc(t.author.session)).revisionId);
    await advanceTo('in_check', t.sessions, t.revisionId);
    const back = await t.checker.session.post(`/api/revisions/${t.revisionId}/return`, {
      reason: 'Missing key seat',
      lockVersion: (await revisionOf(t.author.session, t.revisionId)).lockVersion,
    });
    expectStatus(back, 200, 'return');

    // Act
    const first = expectStatus(await t.author.session.get('/api/dashboard/queues?size=2'), 200, 'queues').body;
    const [mine, returned] = first as (QueuePage & { total: number; totalIsAtLeast: boolean })[];
    const rest = await t.author.session.get(`/api/dashboard/queues/my-drafts?size=2&after=${mine.next}`);

    // Assert
    expect(mine).toMatchObject({ key: 'my-drafts', total: 3, totalIsAtLeast: false });
    expect([...mine.items, ...rest.body.items].map((i: { revisionId: number }) => i.revisionId)).toEqual(drafts);
    expect(rest.body).toMatchObject({ total: null, next: null });
    expect(returned).toMatchObject({ key: 'returned-to-me', total: 1, next: null });
    expect(returned.items.map((i) => i.revisionId)).toEqual([t.revisionId]);
  });
});

describe('an empty queue', () => {
  it('when nothing waits in a queue, then its first page counts none and offers no next page', async () => {
    const t = await team();
    const first = expectStatus(await t.author.session.get('/api/dashboard/queues?size=2'), 200, 'queues').body;
    const returned = (first as (QueuePage & { total: number })[]).find((q) => q.key === 'returned-to-me');
    expect(returned).toMatchObject({ items: [], total: 0, totalIsAtLeast: false, next: null });
  });
});

describe("the checker's queue", () => {
  it('when a calc is submitted, then it waits for every independent checker but not for a checker who edited it', async () => {
    // Arrange
    const t = await team(['author', 'checker']);
    const second = await person(app, ['author'], 'second');
    await advanceTo('approved', t.sessions, t.revisionId);
    const b = expectStatus(
      await second.session.post(`/api/calcs/${t.calcId}/revisions`, { reasonForChange: 'Longer coupling seat' }),
      201,
      'revision B',
    ).body;

    // Act
    await advanceTo('in_check', { ...t.sessions, author: second.session }, b.id);

    // Assert
    expect((await queues(t.checker.session))['awaiting-my-check']).toContain(b.id);
    expect((await queues(t.author.session))['awaiting-my-check']).not.toContain(b.id);
  });

  it("when a calc in check is signed as checked, then it leaves the checkers' queue", async () => {
    // Arrange
    const t = await team();
    const bystander = await person(app, ['checker']);
    await advanceTo('in_check', t.sessions, t.revisionId);
    const before = await queues(bystander.session);

    // Act
    await tickAll(t.checker.session, t.revisionId);
    expectStatus(await sign(t.checker.session, t.revisionId, 'checked'), 200, 'check');

    // Assert
    expect(before['awaiting-my-check']).toContain(t.revisionId);
    expect((await queues(bystander.session))['awaiting-my-check']).not.toContain(t.revisionId);
  });
});

describe("the approver's queue", () => {
  it('when a calc is checked, then it waits for an independent approver but not for the checker+approver who checked it', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const both = await person(app, ['checker', 'approver'], 'chkapp');
    const approver = await person(app, ['approver']);
    const { revisionId } = await createCalc(author.session);

    // Act
    await advanceTo(
      'checked',
      { author: author.session, checker: both.session, approver: approver.session },
      revisionId,
    );

    // Assert
    expect((await queues(approver.session))['awaiting-my-approval']).toContain(revisionId);
    expect((await queues(both.session))['awaiting-my-approval']).not.toContain(revisionId);
  });

  it('when a calc is checked, then it does not wait for an approver who edited an earlier revision', async () => {
    // Arrange
    const t = await team(['author', 'approver']);
    const second = await person(app, ['author'], 'second');
    await advanceTo('approved', t.sessions, t.revisionId);
    const b = expectStatus(
      await second.session.post(`/api/calcs/${t.calcId}/revisions`, { reasonForChange: 'Longer coupling seat' }),
      201,
      'revision B',
    ).body;

    // Act
    await advanceTo('checked', { ...t.sessions, author: second.session }, b.id);

    // Assert
    expect((await queues(t.approver.session))['awaiting-my-approval']).toContain(b.id);
    expect((await queues(t.author.session))['awaiting-my-approval']).not.toContain(b.id);
  });
});
