import { QueryTypes, Transaction } from 'sequelize';
import { startTestApp, expectStatus, person } from '../support/api-harness';
import { advanceTo, createCalc, sign, tickAll } from '../support/calc-harness';
import { filterOf, queueCountSql } from '../../server/dashboard/queues';
import { QUEUE_KEYS, type QueueKey } from '../../shared/schemas/queue.schema';

/*
 * A queue's count on its first page: the checkers' and approvers' queues are counted exactly from the per-state
 * counts less what the reader may not take (server/dashboard/queues.ts). Other spec files change the shared database
 * while this one runs, so each comparison reads both counts in one transaction, from one snapshot.
 */
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

/** The queue's count as the app reads it, and the rows its own filter selects, from one snapshot. */
async function bothCounts(key: QueueKey, userId: number): Promise<[number, number]> {
  return sequelize.transaction(
    { isolationLevel: Transaction.ISOLATION_LEVELS.REPEATABLE_READ },
    async (transaction) => {
      const count = queueCountSql(key, userId);
      const filter = filterOf(key, userId);
      const [fast] = await sequelize.query<{ n: number }>(`SELECT ${count.sql} AS n`, {
        replacements: count.params,
        type: QueryTypes.SELECT,
        transaction,
      });
      const [slow] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM calcs c WHERE ${filter.sql}`, {
        replacements: filter.params,
        type: QueryTypes.SELECT,
        transaction,
      });
      return [Number(fast.n), Number(slow.n)];
    },
  );
}

describe('a queue’s count', () => {
  it('is the number of calcs its filter selects, for readers who edited, checked, or did neither', async () => {
    // Arrange: calcs in check and checked, a checker who also writes, a checker+approver who checks.
    const author = await person(app, ['author']);
    const writerChecker = await person(app, ['author', 'checker'], 'writechk');
    const both = await person(app, ['checker', 'approver'], 'chkapp');
    const approver = await person(app, ['approver']);
    const checker = await person(app, ['checker']);
    const mine = await createCalc(writerChecker.session);
    const theirs = await createCalc(author.session);
    const checked = await createCalc(author.session);
    const noChecker = await createCalc(author.session);
    await advanceTo(
      'in_check',
      { author: writerChecker.session, checker: checker.session, approver: approver.session },
      mine.revisionId,
    );
    await advanceTo(
      'in_check',
      { author: author.session, checker: checker.session, approver: approver.session },
      theirs.revisionId,
    );
    const bothTeam = { author: author.session, checker: both.session, approver: approver.session };
    await advanceTo('checked', bothTeam, checked.revisionId);
    await advanceTo('checked', bothTeam, noChecker.revisionId);
    // A checked calc that names no checker (none arises through the app): the filter leaves it out, so must the count.
    await sequelize.query('UPDATE calcs SET latest_checker_id = NULL WHERE id = ?', {
      replacements: [noChecker.calcId],
    });

    // Act and assert: every reader, every queue.
    for (const reader of [author, writerChecker, both, approver, checker])
      for (const key of QUEUE_KEYS) {
        const [fast, slow] = await bothCounts(key, reader.user.id);
        expect({ reader: reader.user.username, key, n: fast }).toEqual({ reader: reader.user.username, key, n: slow });
      }
  });

  it('reads editor rows that carry their calc’s state, as the triggers keep it through every move', async () => {
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const approver = await person(app, ['approver']);
    const { revisionId, calcId } = await createCalc(author.session);
    const team = { author: author.session, checker: checker.session, approver: approver.session };
    const stateOf = async () =>
      (
        await sequelize.query<{ s: string; e: string }>(
          'SELECT c.latest_status AS s, e.latest_status AS e FROM calc_editors e JOIN calcs c ON c.id = e.calc_id WHERE e.calc_id = ?',
          { replacements: [calcId], type: QueryTypes.SELECT },
        )
      ).map((r) => [r.s, r.e]);
    expect(await stateOf()).toEqual([['draft', 'draft']]);
    await advanceTo('in_check', team, revisionId);
    expect(await stateOf()).toEqual([['in_check', 'in_check']]);
    await tickAll(checker.session, revisionId);
    expectStatus(await sign(checker.session, revisionId, 'checked'), 200, 'check');
    expect(await stateOf()).toEqual([['checked', 'checked']]);
    expectStatus(await sign(approver.session, revisionId, 'approved'), 200, 'approve');
    expect(await stateOf()).toEqual([['approved', 'approved']]);
    const [drift] = await sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM calc_editors e JOIN calcs c ON c.id = e.calc_id WHERE NOT (e.latest_status <=> c.latest_status)',
      { type: QueryTypes.SELECT },
    );
    expect(Number(drift.n)).toBe(0);
  });

  it('is exact, never "at least", for the checkers’ and approvers’ queues on the overview', async () => {
    const checker = await person(app, ['checker', 'approver']);
    const res = expectStatus(await checker.session.get('/api/dashboard/queues?size=5'), 200, 'queues');
    const byKey = Object.fromEntries(
      (res.body as { key: string; total: number; totalIsAtLeast: boolean }[]).map((q) => [q.key, q]),
    );
    for (const key of ['awaiting-my-check', 'awaiting-my-approval']) {
      expect(byKey[key].totalIsAtLeast).toBe(false);
      expect(byKey[key].total).toBeGreaterThanOrEqual(0);
    }
  });
});
