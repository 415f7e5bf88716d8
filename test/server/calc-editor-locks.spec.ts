import { QueryTypes, type Transaction } from 'sequelize';
import { startTestApp } from '../support/api-harness';
import { calcTeam } from '../support/calc-harness';
import { Calc } from '../../server/db/models';

/*
 * Two calcs created at once, in two projects, each by its own transaction: the calc rows, their first states (which
 * the first revision's summary writes), then each author's editor row. The trigger that keeps editor rows' state
 * used to lock the empty gap after a new calc's (missing) editor rows, so the two editor rows deadlocked each other
 * (migrations/20261231-15-calc-editor-state-new-calc.ts). Rolled back at the end: no calc without a revision is left.
 */
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const newCalc = async (t: Transaction, projectId: number, userId: number) =>
  (
    await Calc.create(
      { projectId, number: `L-${Date.now()}-${projectId}`, title: 'Lock test shaft', partRef: '', createdBy: userId },
      { transaction: t },
    )
  ).id;

// What the first revision's summary does to its calc: the state goes from none to draft.
const firstState = (t: Transaction, calcId: number) =>
  sequelize.query("UPDATE calcs SET latest_status = 'draft' WHERE id = ?", { replacements: [calcId], transaction: t });

const insertEditor = (t: Transaction, calcId: number, userId: number) =>
  sequelize.query('INSERT INTO calc_editors (calc_id, user_id, first_edit_at) VALUES (?, ?, UTC_TIMESTAMP(3))', {
    replacements: [calcId, userId],
    transaction: t,
  });

describe('editor rows of calcs created at once', () => {
  it('when two new calcs get their first state and then their editor rows, then neither waits for the other', async () => {
    // Arrange
    const [one, two] = [await calcTeam(app), await calcTeam(app)];
    const [t1, t2] = [await sequelize.transaction(), await sequelize.transaction()];
    try {
      // In the order two creations interleave: both calc rows, then both first states.
      const a = await newCalc(t1, one.project.id, one.author.user.id);
      const b = await newCalc(t2, two.project.id, two.author.user.id);
      await firstState(t1, a);
      await firstState(t2, b);

      // Act: both editor rows, each in its own transaction, at once.
      const inserted = await Promise.allSettled([
        insertEditor(t1, a, one.author.user.id),
        insertEditor(t2, b, two.author.user.id),
      ]);

      // Assert: both went in, each carrying its calc's state.
      expect(inserted.map((r) => (r.status === 'rejected' ? String(r.reason) : r.status))).toEqual([
        'fulfilled',
        'fulfilled',
      ]);
      const states = await Promise.all(
        [
          [t1, a],
          [t2, b],
        ].map(([t, id]) =>
          sequelize.query<{ s: string }>('SELECT latest_status AS s FROM calc_editors WHERE calc_id = ?', {
            replacements: [id],
            transaction: t as Transaction,
            type: QueryTypes.SELECT,
          }),
        ),
      );
      expect(states.map((rows) => rows.map((r) => r.s))).toEqual([['draft'], ['draft']]);
    } finally {
      await Promise.all([t1.rollback().catch(() => undefined), t2.rollback().catch(() => undefined)]);
    }
  });
});
