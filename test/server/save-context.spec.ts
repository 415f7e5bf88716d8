import { QueryTypes, type Transaction } from 'sequelize';
import { person, startTestApp } from '../support/api-harness';
import { createCalc } from '../support/calc-harness';
import { Calc, Revision } from '../../server/db/models';
import { lockWithContext } from '../../server/calcs/save-context';
import { recordEditor } from '../../server/calcs/calc-access';

/*
 * A save locks its revision row, then reads its context (the calc, its project, its editors, the people's names, the
 * standard's stamp, what hangs off the revision) by a plain statement. Nothing but the revision row may be locked
 * (or every save of a project or a standard would queue behind the others), and the context must be read after the
 * lock is granted (or a save that waited would see the calc as it was before the holder's commit): the snapshot of a
 * REPEATABLE READ transaction starts at its first plain read, which must come after the locking one.
 */
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const probe = (t: Transaction, table: string, id: number) =>
  sequelize
    .query(`SELECT 1 FROM ${table} WHERE id = ? FOR UPDATE NOWAIT`, {
      replacements: [id],
      type: QueryTypes.SELECT,
      transaction: t,
    })
    .then(
      (rows) => (rows.length === 1 ? 'free' : `${rows.length} rows`),
      (err: Error) => `locked (${err.message.slice(0, 40)})`,
    );

/**
 * Until the save's locked read is running (the app's database account sees its own threads) and InnoDB counts a row
 * lock being waited for: the test waits for that state, not for a time. (Which waits InnoDB counts is not shown
 * without the PROCESS privilege; another spec file's waits can only end this loop as the read reaches its lock.)
 */
async function untilTheSaveWaits(save: Promise<unknown>, revisionId: number): Promise<void> {
  let settled = false;
  save.then(
    () => (settled = true),
    () => (settled = true),
  );
  // A save that ended (a lock wait timed out, an error) ends the wait too: the test then fails on its outcome.
  while (!settled) {
    const [running] = await sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE INFO LIKE ?',
      { replacements: [`%FROM revisions r WHERE r.id = ${revisionId} FOR UPDATE`], type: QueryTypes.SELECT },
    );
    const [waits] = await sequelize.query<{ Value: string }>(
      "SHOW GLOBAL STATUS LIKE 'Innodb_row_lock_current_waits'",
      { type: QueryTypes.SELECT },
    );
    if (Number(running.n) > 0 && Number(waits.Value) > 0) return;
    await new Promise((resolve) => setImmediate(resolve));
  }
}

describe("a save's locked read", () => {
  it('when a save holds its revision row, then its calc, project, standard and author stay free for other writers', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    const revision = (await Revision.findByPk(revisionId))!;
    const calc = (await Calc.findByPk(revision.calcId))!;
    const other = await sequelize.transaction();

    // Act
    const seen = await sequelize
      .transaction(async (t) => {
        const { context } = await lockWithContext(revisionId, author.user.id, t);
        return {
          project: context.project?.id,
          probes: {
            calc: await probe(other, 'calcs', calc.id),
            project: await probe(other, 'projects', calc.projectId),
            standard: await probe(other, 'rule_sets', revision.ruleSetId),
            author: await probe(other, 'users', author.user.id),
            revision: await probe(other, 'revisions', revisionId),
          },
        };
      })
      .finally(() => other.rollback());

    // Assert
    expect(seen.project).toBe(calc.projectId);
    expect(seen.probes).toEqual({
      calc: 'free',
      project: 'free',
      standard: 'free',
      author: 'free',
      revision: expect.stringMatching(/^locked/),
    });
  });

  it('when a save waits for a revision row another transaction holds, then its context is what that one committed', async () => {
    // Arrange: a transaction holds the row, renames the calc and records another person as its editor.
    const author = await person(app, ['author']);
    const colleague = await person(app, ['author']);
    const { revisionId } = await createCalc(author.session);
    const calcId = (await Revision.findByPk(revisionId))!.calcId;
    const before = await sequelize.transaction(
      async (t) => (await lockWithContext(revisionId, author.user.id, t)).context,
    );
    const holder = await sequelize.transaction();
    const after = await (async () => {
      await sequelize.query('SELECT id FROM revisions WHERE id = ? FOR UPDATE', {
        replacements: [revisionId],
        transaction: holder,
      });
      await sequelize.query("UPDATE calcs SET title = 'Renamed while a save waited' WHERE id = ?", {
        replacements: [calcId],
        transaction: holder,
      });
      await recordEditor(calcId, colleague.user.id, holder);

      // Act: the save's read waits for the row; the holder commits once the database shows it waiting.
      const waiting = sequelize.transaction(
        async (t) => (await lockWithContext(revisionId, author.user.id, t)).context,
      );
      await untilTheSaveWaits(waiting, revisionId);
      await holder.commit();
      return waiting;
    })().finally(() => (holder as unknown as { finished?: string }).finished || holder.rollback());

    // Assert
    expect(before.calc.title).not.toBe('Renamed while a save waited');
    expect(before.editorIds).not.toContain(colleague.user.id);
    expect(after.calc.title).toBe('Renamed while a save waited');
    expect(after.editorIds).toContain(colleague.user.id);
  });
});
