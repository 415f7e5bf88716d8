import { QueryTypes, type Transaction } from 'sequelize';
import { createTestProject, startTestApp, person } from '../support/api-harness';
import { Project, RuleSetRecord } from '../../server/db/models';
import { retryStats, runTransaction } from '../../server/db/transaction';
import { loadRevision } from '../../server/calcs/calc-access';
import { createCalc } from '../support/calc-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

/** Resolves once `count` parties have arrived: both transactions hold their first lock. */
function barrier(count: number) {
  let arrived = 0;
  let open!: () => void;
  const opened = new Promise<void>((resolve) => {
    open = resolve;
  });
  return () => {
    if (++arrived === count) open();
    return opened;
  };
}

const lockProject = (id: number, t: Transaction) =>
  sequelize.query('SELECT id FROM projects WHERE id = ? FOR UPDATE', { replacements: [id], transaction: t });
const mark = (id: number, text: string, t: Transaction) =>
  sequelize.query('UPDATE projects SET name = CONCAT(name, ?) WHERE id = ?', {
    replacements: [text, id],
    transaction: t,
  });

describe('a transaction the database aborts is run again', () => {
  it('when two transactions lock the same two rows in opposite order, then one is aborted for a deadlock, run again, and both changes are stored', async () => {
    // Arrange
    const [a, b] = [await createTestProject(), await createTestProject()];
    const bothHoldOne = barrier(2);
    const before = retryStats.byCause['1213'] ?? 0;
    const crossing = (first: number, second: number, text: string) =>
      runTransaction(sequelize, async (t, attempt) => {
        await lockProject(first, t);
        if (attempt === 1) await bothHoldOne();
        await mark(second, text, t);
        await mark(first, text, t);
        return attempt;
      });

    // Act
    const attempts = await Promise.all([crossing(a.id, b.id, ' [one]'), crossing(b.id, a.id, ' [two]')]);

    // Assert
    expect(attempts.sort()).toEqual([1, 2]);
    expect(retryStats.byCause['1213']).toBe(before + 1);
    for (const id of [a.id, b.id]) {
      const { name } = (await Project.findByPk(id))!;
      expect(name.match(/\[one\]/g)).toHaveLength(1);
      expect(name.match(/\[two\]/g)).toHaveLength(1);
    }
  });

  it('when a lock is not granted within the wait limit, then the transaction is run again once the lock is free', async () => {
    // Arrange
    const project = await createTestProject();
    const before = retryStats.byCause['1205'] ?? 0;
    let releaseHolder!: () => void;
    const holderMayCommit = new Promise<void>((resolve) => {
      releaseHolder = resolve;
    });
    let holderLocked!: () => void;
    const locked = new Promise<void>((resolve) => {
      holderLocked = resolve;
    });
    const holder = runTransaction(sequelize, async (t) => {
      await lockProject(project.id, t);
      holderLocked();
      await holderMayCommit;
      await mark(project.id, ' [holder]', t);
    });
    await locked;

    // Act
    // Only the first attempt waits briefly: the retry waits as long as the holder needs to commit once let go, however
    // slow the machine is, instead of timing out again and again until the retries run out.
    const waiter = runTransaction(sequelize, async (t, attempt) => {
      if (attempt === 1) await sequelize.query('SET SESSION innodb_lock_wait_timeout = 1', { transaction: t });
      try {
        await mark(project.id, ' [waiter]', t);
      } finally {
        await sequelize
          .query('SET SESSION innodb_lock_wait_timeout = DEFAULT', { transaction: t })
          .catch(() => undefined);
      }
      return attempt;
    });
    // The holder lets go only after the waiter's first attempt has timed out and been retried.
    while ((retryStats.byCause['1205'] ?? 0) === before) await new Promise((r) => setTimeout(r, 50));
    releaseHolder();
    const [, attempt] = await Promise.all([holder, waiter]);

    // Assert
    expect(attempt).toBeGreaterThan(1);
    expect((await Project.findByPk(project.id))!.name).toMatch(/\[holder\].*\[waiter\]$/);
  });

  it('when an error is not the database aborting the transaction, then it is not retried', async () => {
    // Arrange
    let runs = 0;

    // Act
    const outcome = runTransaction(sequelize, async () => {
      runs++;
      throw new Error('a bug, not a deadlock');
    });

    // Assert
    await expect(outcome).rejects.toThrow('a bug, not a deadlock');
    expect(runs).toBe(1);
  });
});

describe('a revision locked for change', () => {
  it("when a revision is loaded for change, then only its row is locked, not its standard's or its author's", async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    const other = await sequelize.transaction();

    // Act
    const free = await runTransaction(sequelize, async (t) => {
      const revision = await loadRevision(revisionId, t);
      const probe = (sql: string, id: number) =>
        sequelize.query(sql, { replacements: [id], type: QueryTypes.SELECT, transaction: other });
      const ruleSet = await probe('SELECT id FROM rule_sets WHERE id = ? FOR UPDATE NOWAIT', revision.ruleSetId);
      const user = await probe('SELECT id FROM users WHERE id = ? FOR UPDATE NOWAIT', revision.authorId);
      const row = await probe('SELECT id FROM revisions WHERE id = ? FOR UPDATE NOWAIT', revisionId).catch(
        (err: Error) => err,
      );
      return { ruleSet, user, row, shown: revision.ruleSet?.code, authorName: revision.author?.displayName };
    }).finally(() => other.rollback());

    // Assert
    expect(free.ruleSet).toHaveLength(1);
    expect(free.user).toHaveLength(1);
    expect(free.row).toBeInstanceOf(Error);
    expect(free.shown).toBe((await RuleSetRecord.findByPk((await loadRevision(revisionId)).ruleSetId))!.code);
    expect(free.authorName).toBe(author.displayName);
  });
});
