import mariadb, { type Connection } from 'mariadb';
import { startTestApp } from '../support/api-harness';
import {
  advanceTo, auditOf, createCalc, expectStatus, person, revisionOf, sign, tickAll, type Team,
} from '../support/calc-harness';

const { app, sequelize, config } = startTestApp();
afterAll(() => sequelize.close());

const TRIGGERS = ['audit_events_no_update', 'audit_events_no_delete'];

/** A connection of its own, outside the app's pool: the test account owns its database, triggers included. */
function connect(): Promise<Connection> {
  return mariadb.createConnection({ host: config.DB_HOST, port: config.DB_PORT, user: config.DB_USER, password: config.DB_PASSWORD, database: config.DB_NAME });
}

/**
 * Runs `work` as someone with full database rights would tamper: the append-only triggers are
 * dropped and recreated from their own stored definitions afterwards, whatever happens. The chain
 * head is locked meanwhile, so no other test appends while the trail is open, and the tail is fixed.
 */
async function withTriggersLifted<T>(work: (db: Connection, tailId: number) => Promise<T>): Promise<T> {
  const lock = await connect();
  const db = await connect();
  const definitions: string[] = [];
  try {
    await lock.beginTransaction();
    const [head] = await lock.query('SELECT last_id FROM audit_chain_head WHERE id = 1 FOR UPDATE');
    for (const name of TRIGGERS) definitions.push((await db.query(`SHOW CREATE TRIGGER ${name}`))[0]['SQL Original Statement']);
    for (const name of TRIGGERS) await db.query(`DROP TRIGGER ${name}`);
    return await work(db, Number(head.last_id));
  } finally {
    const present = (await db.query('SELECT TRIGGER_NAME AS name FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = DATABASE()')).map((r: { name: string }) => r.name);
    for (const [i, name] of TRIGGERS.entries()) if (definitions[i] && !present.includes(name)) await db.query(definitions[i]);
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

describe('every workflow event is on the trail', () => {
  it('when a calc goes from draft through a return to approval and a second revision, then each step is an audit entry by the person who did it', async () => {
    // Arrange
    const author = await person(app, ['author']);
    const checker = await person(app, ['checker']);
    const approver = await person(app, ['approver']);
    const team: Team = { author: author.session, checker: checker.session, approver: approver.session };
    const { calcId, revisionId } = await createCalc(author.session);

    // Act
    const r0 = await revisionOf(author.session, revisionId);
    expectStatus(await author.session.put(`/api/revisions/${revisionId}`, { input: { ...r0.input, title: 'Head shaft, longer hub' }, lockVersion: r0.lockVersion }), 200, 'save');
    await sign(author.session, revisionId, 'authored', { password: 'wrong password' });
    await advanceTo('in_check', team, revisionId);
    const returned = await checker.session.post(`/api/revisions/${revisionId}/return`, { reason: 'Cite the Kts chart', lockVersion: 1 });
    await author.session.post(`/api/findings/${returned.body.findings[0].id}/answer`, { answer: 'Peterson 3.2' });
    await advanceTo('in_check', team, revisionId);
    await checker.session.post(`/api/findings/${returned.body.findings[0].id}/close`);
    await tickAll(checker.session, revisionId);
    expectStatus(await sign(checker.session, revisionId, 'checked'), 200, 'check');
    expectStatus(await sign(approver.session, revisionId, 'approved'), 200, 'approve');
    const b = expectStatus(await author.session.post(`/api/calcs/${calcId}/revisions`, { reasonForChange: 'New coupling' }), 201, 'revision B');
    await advanceTo('approved', team, b.body.id);

    // Assert
    expect((await auditOf('Calc', calcId)).map((e) => [e.action, e.actorId])).toEqual([['calc.created', author.user.id]]);
    const by = (id: number) => ({ [author.user.id]: 'author', [checker.user.id]: 'checker', [approver.user.id]: 'approver' })[id];
    expect((await auditOf('Revision', revisionId)).map((e) => `${e.action} by ${by(e.actorId!)}`)).toEqual([
      'revision.saved by author', 'revision.signature_refused by author', 'revision.signed_authored by author',
      'revision.returned by checker', 'finding.answered by author', 'revision.signed_authored by author', 'finding.closed by checker',
      'revision.manual_item by checker', 'revision.manual_item by checker', 'revision.manual_item by checker',
      'revision.signed_checked by checker', 'revision.signed_approved by approver', 'revision.superseded by approver',
    ]);
    expect((await auditOf('Revision', b.body.id)).map((e) => e.action)).toEqual([
      'revision.created', 'revision.signed_authored', 'revision.manual_item', 'revision.manual_item', 'revision.manual_item',
      'revision.signed_checked', 'revision.signed_approved',
    ]);
    expect((await auditOf('Revision', revisionId))[0].diff).toMatch(/^\+\s+"title": "Head shaft, longer hub",?$/m);
  });
});

describe('tamper evidence', () => {
  it('when one audit row is edited behind the app\'s back, then verify reports the chain broken at that row, and ok once it is restored', async () => {
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
    await expect(sequelize.query('UPDATE audit_events SET actor_name = actor_name WHERE id = ?', { replacements: [target.id] })).rejects.toThrow(/append-only/);
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
    await expect(sequelize.query('DELETE FROM audit_events WHERE id = ?', { replacements: [target.id] })).rejects.toThrow(/append-only/);
  });

  // Cutting entries off the end leaves every remaining link intact; only the chain head still knows.
  it('when the newest audit row is deleted, then verify reports the missing row', async () => {
    // Arrange
    const { verify } = await auditor();
    await person(app, ['author']);
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));

    // Act
    const { tampered, tailId } = await withTriggersLifted(async (db, tail) => ({ tailId: tail, tampered: await withRowDeleted(db, tail, verify) }));

    // Assert
    expect(tampered).toEqual(expect.objectContaining({ ok: false, brokenAt: tailId }));
    expect(await verify()).toEqual(expect.objectContaining({ ok: true }));
  });
});
