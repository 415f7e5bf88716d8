// Folds the last changes that saves recorded in calc_search_moved back into the calcs' search terms.
import { QueryTypes, type Sequelize } from 'sequelize';
import { runTransaction } from '../db/transaction';
import { logger } from '../logger';

/** A calc's moved row is folded back once its last change is this old (its author has likely stopped saving). */
export const RESTAMP = { quietSeconds: 300, batch: 200, pollSeconds: 60 };

/**
 * One batch: the moved rows whose last change is older than `quietSeconds`, locked, copied into their calcs' term rows
 * and deleted, in one transaction. A save of one of those calcs meanwhile waits for the lock on its moved row and then
 * writes a new one; a save that came first made its row too new to be taken. Returns the calcs folded back (a batch
 * whose rows a save took in the meantime folds fewer than it saw; the next round takes the rest).
 */
export async function restampOnce(sequelize: Sequelize, quietSeconds = RESTAMP.quietSeconds): Promise<number> {
  return runTransaction(
    sequelize,
    async (transaction) => {
      // The candidates by a plain read, then locked one by one by primary key and taken if still quiet: a locking
      // read of the time range would also lock the gap where saves add their rows, and deadlocked with them.
      const quiet = `latest_updated_at < NOW(3) - INTERVAL ${Number(quietSeconds)} SECOND`;
      const seen = await sequelize.query<{ calc_id: number }>(
        `SELECT calc_id FROM calc_search_moved FORCE INDEX (moved_updated) WHERE ${quiet}
        ORDER BY latest_updated_at LIMIT ${RESTAMP.batch}`,
        { type: QueryTypes.SELECT, transaction },
      );
      if (seen.length === 0) return 0;
      const rows = await sequelize.query<{ calc_id: number }>(
        `SELECT calc_id FROM calc_search_moved WHERE calc_id IN (?) AND ${quiet} FOR UPDATE`,
        { replacements: [seen.map((r) => Number(r.calc_id))], type: QueryTypes.SELECT, transaction },
      );
      if (rows.length === 0) return 0;
      const ids = rows.map((r) => Number(r.calc_id));
      await sequelize.query(
        `UPDATE calc_search_terms t JOIN calc_search_moved m ON m.calc_id = t.calc_id
      SET t.latest_updated_at = m.latest_updated_at WHERE m.calc_id IN (?)`,
        { replacements: [ids], transaction },
      );
      await sequelize.query('DELETE FROM calc_search_moved WHERE calc_id IN (?)', { replacements: [ids], transaction });
      return ids.length;
    },
    // Run again after a COMMIT that may have landed, it finds the rows gone, or unchanged: the same fold.
    { idempotent: true },
  );
}

/**
 * Runs batches every `pollSeconds` in this process (every instance may: the rows are locked, and a batch that finds
 * them gone folds nothing). Off in the test harness, which calls `restampOnce` itself.
 */
export function startSearchRestamp(sequelize: Sequelize): { stop: () => Promise<void> } {
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<unknown> = Promise.resolve();
  const tick = () => {
    running = (async () => {
      while ((await restampOnce(sequelize)) === RESTAMP.batch && timer);
    })()
      .catch((err) => logger.error({ err }, 'folding saved calcs back into the search terms failed; will retry'))
      .finally(() => {
        if (timer) timer = setTimeout(tick, RESTAMP.pollSeconds * 1000);
      });
  };
  timer = setTimeout(tick, RESTAMP.pollSeconds * 1000);
  return {
    stop: async () => {
      clearTimeout(timer);
      timer = undefined;
      await running;
    },
  };
}
