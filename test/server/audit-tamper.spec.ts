import mariadb, { type Connection } from 'mariadb';
import { tamperTestApp } from '../support/tamper-db';
import { auditOf } from '../support/audit-harness';
import { createCalc } from '../support/calc-harness';
import { expectStatus, person } from '../support/api-harness';

// Breaking the audit chain on purpose and showing that verify finds the break, in a database of its own.
const { app, sequelize, config } = tamperTestApp();

const TRIGGERS = ['audit_events_no_update', 'audit_events_no_delete'];

/** A connection of its own, outside the app's pool: the test account owns its database, triggers included. */
function connect(): Promise<Connection> {
  return mariadb.createConnection({
    host: config.DB_HOST,
    port: config.DB_PORT,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
    database: config.DB_NAME,
  });
}

/**
 * Runs `work` as someone with full database rights would tamper: the append-only triggers are
 * dropped and recreated from their own stored definitions afterwards, whatever happens. The chain
 * head is locked meanwhile, so nothing appends while the trail is open, and the tail is fixed. This file has
 * a database of its own (test/support/tamper-db.ts), so no other suite waits for that lock.
 */
async function withTriggersLifted<T>(work: (db: Connection, tailId: number) => Promise<T>): Promise<T> {
  const lock = await connect();
  const db = await connect();
  const definitions: string[] = [];
  try {
    await lock.beginTransaction();
    const [head] = await lock.query('SELECT last_id FROM audit_chain_head WHERE id = 1 FOR UPDATE');
    for (const name of TRIGGERS)
      definitions.push((await db.query(`SHOW CREATE TRIGGER ${name}`))[0]['SQL Original Statement']);
    for (const name of TRIGGERS) await db.query(`DROP TRIGGER ${name}`);
    return await work(db, Number(head.last_id));
  } finally {
    const present = (
      await db.query('SELECT TRIGGER_NAME AS name FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = DATABASE()')
    ).map((r: { name: string }) => r.name);
    for (const [i, name] of TRIGGERS.entries())
      if (definitions[i] && !present.includes(name)) await db.query(definitions[i]);
    await lock.rollback();
    await Promise.all([lock.end(), db.end()]);
  }
}

/** Deletes one audit row, runs `check`, and puts the identical row back (same id, same bytes). */
async function withRowDeleted<T>(db: Connection, id: number, check: () => Promise<T>): Promise<T> {
  await db.query('CREATE TEMPORARY TABLE tt_deleted_audit_row AS SELECT * FROM audit_events WHERE id = ?', [id]);
  try {
    await db.query('DELETE FROM audit_events WHERE id = ?', [id]);
    return await check();
  } finally {
    await db.query('INSERT IGNORE INTO audit_events SELECT * FROM tt_deleted_audit_row');
    await db.query('DROP TEMPORARY TABLE tt_deleted_audit_row');
  }
}

async function auditor() {
  const compliance = await person(app, ['compliance']);
  return { verify: async () => expectStatus(await compliance.session.get('/api/audit/verify'), 200, 'verify').body };
}

describe('tamper evidence', () => {
  it("when one audit row is edited behind the app's back, then verify reports the chain broken at that row, and ok once it is restored", async () => {
    // Arrange
    const { verify } = await auditor();
    const author = await person(app, ['author']);
    const { calcId } = await createCalc(author.session);
    const [target] = await auditOf('Calc', calcId);
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));

    // Act
    const [tampered, restored] = await withTriggersLifted(async (db) => {
      await db.query("UPDATE audit_events SET actor_name = 'Someone Else' WHERE id = ?", [target.id]);
      const broken = await verify();
      await db.query('UPDATE audit_events SET actor_name = ? WHERE id = ?', [target.actorName, target.id]);
      return [broken, await verify()];
    });

    // Assert
    expect(tampered).toEqual(expect.objectContaining({ ok: false, brokenAt: target.id }));
    expect(restored).toEqual(expect.objectContaining({ ok: true }));
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));
    await expect(
      sequelize.query('UPDATE audit_events SET actor_name = actor_name WHERE id = ?', { replacements: [target.id] }),
    ).rejects.toThrow(/append-only/);
  });

  it('when an audit row in the middle is deleted, then verify reports the chain broken at the row after it', async () => {
    // Arrange
    const { verify } = await auditor();
    const author = await person(app, ['author']);
    const { calcId } = await createCalc(author.session);
    const [target] = await auditOf('Calc', calcId);
    await person(app, ['author']); // one more entry after the target, so it is not the last
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));

    // Act
    const { tampered, next } = await withTriggersLifted(async (db) => {
      const [row] = await db.query('SELECT MIN(id) AS next FROM audit_events WHERE id > ?', [target.id]);
      return { next: Number(row.next), tampered: await withRowDeleted(db, target.id, verify) };
    });

    // Assert
    expect(tampered).toEqual(expect.objectContaining({ ok: false, brokenAt: next }));
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));
    await expect(
      sequelize.query('DELETE FROM audit_events WHERE id = ?', { replacements: [target.id] }),
    ).rejects.toThrow(/append-only/);
  });

  // Cutting entries off the end leaves every remaining link intact; only the chain head still knows.
  it('when the newest audit row is deleted, then verify reports the missing row', async () => {
    // Arrange
    const { verify } = await auditor();
    await person(app, ['author']);
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));

    // Act
    const { tampered, tailId } = await withTriggersLifted(async (db, tail) => ({
      tailId: tail,
      tampered: await withRowDeleted(db, tail, verify),
    }));

    // Assert
    expect(tampered).toEqual(expect.objectContaining({ ok: false, brokenAt: tailId }));
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));
  });
});
