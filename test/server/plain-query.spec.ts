import { DataTypes, DatabaseError, Model, QueryTypes, Sequelize, type Transaction } from 'sequelize';
import { loadConfig } from '../../server/config';
import { sequelizeOptions } from '../../server/db';
import { classifyDbError } from '../../server/db/db-errors';
import { plainRun, plainSelect, plainSelectWarned, sqlTime } from '../../server/db/plain-query';
import { plainUpdate } from '../../server/db/plain-update';
import { CLOCK_SLACK_MS } from '../support/wall-clock';

// Hot reads go to the driver on Sequelize's pooled connections (server/db/plain-query.ts). Whatever is read through
// it must be what `sequelize.query(…, { type: SELECT })` gives: the same rows in both decodings the app uses, the same
// values written for `?`, the same errors, and every connection handed back.
const config = loadConfig();
const open = (decoding: 'driver' | 'cast', poolMax = 3) =>
  new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
    ...sequelizeOptions(config, decoding),
    pool: { max: poolMax, min: 0, idle: 10_000, acquire: 20_000 },
  });
const driver = open('driver');
const cast = open('cast');
const table = `plain_probe_${process.pid}`;

beforeAll(async () => {
  await driver.query(`CREATE TABLE ${table} (
    id INT UNSIGNED NOT NULL PRIMARY KEY, at3 DATETIME(3) NULL, body LONGTEXT NULL, amount DECIMAL(14,4) NULL,
    big BIGINT UNSIGNED NULL, flag TINYINT(1) NULL, state ENUM('draft','approved') NULL)`);
  await driver.query(
    `INSERT INTO ${table} VALUES
      (1, '2026-03-29 01:30:00.123', 'Ø 40 mm — “shaft” ? it''s', 12345.6789, 9007199254740993, 1, 'approved'),
      (2, '1999-12-31 23:59:59.999', '', -0.0001, 42, 0, 'draft'),
      (3, NULL, NULL, NULL, NULL, NULL, NULL)`,
  );
});
afterAll(async () => {
  await driver.query(`DROP TABLE IF EXISTS ${table}`);
  await Promise.all([driver.close(), cast.close()]);
});

const viaSequelize = (db: Sequelize, sql: string, replacements: unknown[], transaction?: Transaction) =>
  db.query<Record<string, unknown>>(sql, { replacements, type: QueryTypes.SELECT, transaction });

// The rows each statement finds, so that an empty answer on both sides cannot pass for agreement.
const statements: [string, string, unknown[], number][] = [
  ['every column of every row', `SELECT * FROM ${table} ORDER BY id`, [], 3],
  [
    'a list and text with a quote',
    `SELECT id FROM ${table} WHERE id IN (?) OR body LIKE ? ORDER BY id`,
    [[2], "%it's"],
    2,
  ],
  ['a time as a Date', `SELECT id, at3 > ? AS later FROM ${table} WHERE at3 IS NOT NULL ORDER BY id`, [new Date(0)], 2],
  ['a time to the millisecond', `SELECT id FROM ${table} WHERE at3 = ?`, [new Date('2026-03-29T01:30:00.123Z')], 1],
  ['a question mark inside a string', `SELECT '?' AS mark, id FROM ${table} WHERE id = ?`, [2], 1],
  ['no row', `SELECT id FROM ${table} WHERE id = ?`, [99], 0],
];

describe('a plain statement', () => {
  it.each(statements)(
    'when it reads %s, then the rows are those Sequelize gives, in both decodings',
    async (_, sql, v) => {
      for (const db of [driver, cast]) {
        const plain = await plainSelect<Record<string, unknown>>(db, sql, v);
        expect(plain).toEqual(await viaSequelize(db, sql, v));
        expect(Object.keys(plain)).not.toContain('meta');
      }
    },
  );

  it('when it runs inside a transaction, then it sees that transaction and reads its lock', async () => {
    await driver
      .transaction(async (t) => {
        await driver.query(`UPDATE ${table} SET body = 'inside' WHERE id = 3`, { transaction: t });
        const [row] = await plainSelect<{ body: string }>(
          driver,
          `SELECT body FROM ${table} WHERE id = ? FOR UPDATE`,
          [3],
          t,
        );
        expect(row.body).toBe('inside');
        throw new Error('roll back');
      })
      .catch((e: Error) => expect(e.message).toBe('roll back'));
    const [after] = await plainSelect<{ body: string | null }>(driver, `SELECT body FROM ${table} WHERE id = 3`);
    expect(after.body).toBeNull();
  });

  it('when its transaction has ended, then it is refused, never sent on a connection back in the pool', async () => {
    const t = await driver.transaction();
    await t.commit();
    await expect(plainSelect(driver, 'SELECT 1 AS one', [], t)).rejects.toThrow(/commit has been called/);
  });

  it('when a time is sent, then it is the database session UTC text whatever the zone', () => {
    expect(sqlTime(new Date('2026-12-05T09:04:05.067Z'))).toBe('2026-12-05 09:04:05.067');
  });

  it('when a value is neither text, number, list nor time, then nothing is sent and the caller hears why', async () => {
    await expect(plainSelect(driver, `SELECT ? AS x`, [{ a: 1 }])).rejects.toThrow(/must be text, a number/);
  });

  it('when the statement fails, then the error is the one Sequelize throws, and its connection goes back', async () => {
    for (let i = 0; i < 5; i++) {
      const err = await plainSelect(driver, `SELECT nothing_here FROM ${table}`).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(DatabaseError);
      expect((err as DatabaseError).sql).toContain('nothing_here');
    }
    // Three connections in the pool: had a failure kept one, these would wait past the time-out.
    const many = await Promise.all(Array.from({ length: 12 }, (_, i) => plainSelect(driver, 'SELECT ? AS i', [i])));
    expect(many.map(([r]) => Number((r as { i: number }).i))).toEqual([...Array(12).keys()]);
  });

  it('when a lock is not granted in time, then the error reads as a rolled-back transaction to retry', async () => {
    const holder = await driver.transaction();
    try {
      await plainSelect(driver, `SELECT id FROM ${table} WHERE id = 2 FOR UPDATE`, [], holder);
      const err = await driver
        .transaction(async (t) => {
          await driver.query('SET SESSION innodb_lock_wait_timeout = 1', { transaction: t });
          return plainSelect(driver, `SELECT id FROM ${table} WHERE id = ? FOR UPDATE`, [2], t);
        })
        .catch((e: unknown) => e);
      expect(classifyDbError(err)).toBe('rolled_back');
      expect((err as { parent?: { errno?: number } }).parent?.errno).toBe(1205);
    } finally {
      await holder.rollback();
    }
  });

  it('when a statement whose answer is not read runs in a transaction, then it counts in that transaction only', async () => {
    const t = await driver.transaction();
    await plainRun(driver, `UPDATE ${table} SET body = ? WHERE id = ?`, ['run inside', 3], t);
    const [seen] = await plainSelect<{ body: string }>(driver, `SELECT body FROM ${table} WHERE id = 3`, [], t);
    await t.rollback();
    const [after] = await plainSelect<{ body: string | null }>(driver, `SELECT body FROM ${table} WHERE id = 3`);
    expect([seen.body, after.body]).toEqual(['run inside', null]);
    const bad = await driver.transaction();
    const err = await plainRun(driver, `UPDATE ${table} SET nothing_here = 1`, [], bad).catch((e: unknown) => e);
    await bad.rollback();
    expect(err).toBeInstanceOf(DatabaseError);
  });

  it('when Sequelize logs statements, then a plain one is logged with its values written in', async () => {
    const options = (driver as unknown as { options: { logging: unknown } }).options;
    const before = options.logging;
    const seen: string[] = [];
    options.logging = (sql: string) => seen.push(sql);
    try {
      await plainSelect(driver, `SELECT id FROM ${table} WHERE id IN (?) AND body <> ?`, [[1, 2], "it's"]);
    } finally {
      options.logging = before;
    }
    expect(seen).toEqual([`Executing (default): SELECT id FROM ${table} WHERE id IN (1, 2) AND body <> 'it\\'s'`]);
  });

  it("when its warnings are asked for, then they are the statement's own, read on its connection, and only when asked", async () => {
    // Three connections, each pair of statements sent at once: a count read on another connection would be its own.
    const cut = `SELECT a.id FROM ${table} a JOIN ${table} b ORDER BY a.id LIMIT 9 ROWS EXAMINED 2`;
    const clean = `SELECT id FROM ${table} ORDER BY id`;
    const runs = await Promise.all(
      Array.from({ length: 12 }, (_, i) =>
        plainSelectWarned<{ id: number }>(driver, i % 2 ? cut : clean, [], (rows) => i % 4 < 2 || rows.length > 99),
      ),
    );
    expect(runs.map((r) => r.warnings > 0)).toEqual(Array.from({ length: 12 }, (_, i) => i % 4 === 1));
    expect(runs.filter((_, i) => i % 2 === 0).map((r) => r.rows.map((row) => Number(row.id)))).toEqual(
      Array.from({ length: 6 }, () => [1, 2, 3]),
    );
    expect(runs.every((r) => !('meta' in r.rows))).toBe(true);
  });
});

describe('a plain update', () => {
  class Probe extends Model {
    declare id: number;
    declare bodyText: string;
    declare lockVersion: number;
    declare state: 'draft' | 'approved';
    declare updatedAt: Date;
  }
  Probe.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      bodyText: { type: DataTypes.TEXT('long'), allowNull: false },
      lockVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      state: { type: DataTypes.ENUM('draft', 'approved'), allowNull: false },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize: driver, tableName: `plain_update_${process.pid}`, underscored: true },
  );
  beforeAll(() => Probe.sync());
  afterAll(() => Probe.drop());

  it('when an instance changed, then its row is written as save() writes it, and the instance is left unchanged', async () => {
    // Arrange: two equal rows; the state of the second changed in the database behind the instance's back.
    const [bySave, byPlain] = await Promise.all(
      [1, 2].map((id) => Probe.create({ id, bodyText: 'before', lockVersion: 0, state: 'draft' })),
    );
    await driver.query(`UPDATE plain_update_${process.pid} SET state = 'approved' WHERE id = 2`);
    const started = Date.now();
    for (const p of [bySave, byPlain]) p.set({ bodyText: "Ø 40 mm — “shaft” ? it's", lockVersion: 1 });
    // A value set on the instance that names no column is written by neither (Sequelize does not count it as changed).
    for (const p of [bySave, byPlain]) p.set('notAColumn' as never, 'x' as never);

    // Act
    await driver.transaction(async (transaction) => {
      await bySave.save({ transaction });
      await plainUpdate(byPlain, transaction);
    });

    // Assert: the changed columns and the time written; the column the instance did not change left as stored.
    const rows = await driver.query<Record<string, unknown>>(
      `SELECT id, body_text, lock_version, state, updated_at FROM plain_update_${process.pid} ORDER BY id`,
      { type: QueryTypes.SELECT },
    );
    expect(rows.map(({ id, ...r }) => ({ ...r, updated_at: undefined, id }))).toEqual([
      { id: 1, body_text: "Ø 40 mm — “shaft” ? it's", lock_version: 1, state: 'draft', updated_at: undefined },
      { id: 2, body_text: "Ø 40 mm — “shaft” ? it's", lock_version: 1, state: 'approved', updated_at: undefined },
    ]);
    const written = new Date(rows[1].updated_at as Date).getTime();
    // Now, give or take the wall clock: a machine's time service may step it back between two readings (CI saw
    // 8 ms), so the bound is loose; what was written is the instance's own time, exactly.
    expect(Math.abs(written - started)).toBeLessThan(CLOCK_SLACK_MS);
    expect(written).toBe(byPlain.updatedAt.getTime());
    expect(byPlain.changed()).toBe(false);
    expect(byPlain.previous('bodyText')).toBe("Ø 40 mm — “shaft” ? it's");
    // Nothing changed since: nothing is sent.
    const sent: string[] = [];
    await driver.transaction(async (transaction) => {
      const options = (driver as unknown as { options: { logging: unknown } }).options;
      const before = options.logging;
      options.logging = (sql: string) => sent.push(sql);
      try {
        await plainUpdate(byPlain, transaction);
      } finally {
        options.logging = before;
      }
    });
    expect(sent.filter((sql) => /UPDATE/.test(sql))).toEqual([]);
  });
});
