import { QueryTypes, Sequelize } from 'sequelize';
import { loadConfig } from '../../server/config';
import { processClockIsUtc, sequelizeOptions } from '../../server/db';
import { initModels } from '../../server/db/models';
import { RuleSetRecord, isoDateOf } from '../../server/db/models/rule-set-record';

// The app lets the driver decode values itself when the process clock is UTC, instead of Sequelize's per-value cast
// (server/db/index.ts). Both must read every kind of column the schema uses as the same value; a DATE is the one
// difference (a Date at local midnight instead of text), which the one DATE attribute's getter mends.
const config = loadConfig();
const open = (decoding?: 'driver' | 'cast') =>
  new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, sequelizeOptions(config, decoding));
// The decoding this process chooses: the driver's own here, where the clock is UTC; the cast in another zone.
const driver = open();
const cast = open('cast');
initModels(driver);
const table = `decoding_probe_${process.pid}`;

beforeAll(async () => {
  await driver.query(`CREATE TABLE ${table} (
    id INT UNSIGNED NOT NULL PRIMARY KEY, at3 DATETIME(3) NULL, at DATETIME NULL, day DATE NULL, amount DECIMAL(14,4),
    big BIGINT UNSIGNED, flag TINYINT(1), body LONGTEXT, doc JSON, state ENUM('draft','approved'))`);
  await driver.query(
    `INSERT INTO ${table} VALUES
      (1, '2026-03-29 01:30:00.123', '2026-10-25 01:30:00', '2026-02-28', 12345.6789, 9007199254740993, 1,
       'Ø 40 mm — “shaft”', '{"a":[1,2.5,"x"]}', 'approved'),
      (2, '1999-12-31 23:59:59.999', '2000-01-01 00:00:00', '2024-02-29', -0.0001, 42, 0, '', '{}', 'draft'),
      (3, NULL, NULL, NULL, NULL, NULL, NULL, NULL, NULL, NULL)`,
  );
});
afterAll(async () => {
  await driver.query(`DROP TABLE IF EXISTS ${table}`);
  await Promise.all([driver.close(), cast.close()]);
});

const rows = (db: Sequelize, sql: string) => db.query<Record<string, unknown>>(sql, { type: QueryTypes.SELECT });

describe('values decoded by the driver itself', () => {
  it('is used where the process clock is UTC by name, and not in a zone that is at UTC only today', () => {
    expect(processClockIsUtc('UTC')).toBe(true);
    for (const zone of ['Europe/London', 'Atlantic/Reykjavik', 'Africa/Abidjan', 'America/Chicago'])
      expect(processClockIsUtc(zone)).toBe(false);
    // Node's ICU gives every alias of UTC (Etc/UTC, GMT, Zulu …) as UTC.
    expect(new Intl.DateTimeFormat('en', { timeZone: 'Etc/UTC' }).resolvedOptions().timeZone).toBe('UTC');
  });

  it('reads every column kind as the per-value cast does, a DATE as the same day', async () => {
    const sql = `SELECT *, at3 + INTERVAL 1 DAY AS later, COUNT(*) OVER () AS n, SUM(amount) OVER () AS total
      FROM ${table} ORDER BY id`;
    const [fromDriver, fromCast] = await Promise.all([rows(driver, sql), rows(cast, sql)]);
    expect(fromDriver.map((r) => ({ ...r, day: isoDateOf(r.day) }))).toEqual(fromCast);
    // Stored in UTC and read as UTC, to the millisecond, on either side of a summer-time change.
    expect((fromDriver[0].at3 as Date).toISOString()).toBe('2026-03-29T01:30:00.123Z');
    expect((fromDriver[0].at as Date).toISOString()).toBe('2026-10-25T01:30:00.000Z');
    expect((fromDriver[1].later as Date).toISOString()).toBe('2000-01-01T23:59:59.999Z');
    expect(fromCast[0].day).toBe('2026-02-28');
    expect(fromDriver[2]).toMatchObject({ at3: null, day: null, amount: null, doc: null });
  });

  it("gives a standard's effective date as YYYY-MM-DD whichever way it was read", async () => {
    expect(isoDateOf(new Date(2024, 1, 29))).toBe('2024-02-29');
    expect(isoDateOf('2026-12-05')).toBe('2026-12-05');
    expect(isoDateOf(null)).toBeNull();
    const record = RuleSetRecord.build({ effectiveDate: new Date(2026, 11, 5) } as never, { raw: true });
    expect(record.effectiveDate).toBe('2026-12-05');
    expect(record.toJSON().effectiveDate).toBe('2026-12-05');
    const t = await driver.transaction();
    try {
      const fields = { code: `DEC-${process.pid}`, version: 1, title: 'Decoding', document: '{}', contentHash: '0' };
      const created = await RuleSetRecord.create(
        { ...fields, effectiveDate: '2024-02-29', createdBy: null },
        { transaction: t },
      );
      const read = await RuleSetRecord.findByPk(created.id, { transaction: t });
      expect(read!.effectiveDate).toBe('2024-02-29');
    } finally {
      await t.rollback();
    }
  });
});
