import { Op } from 'sequelize';
import { startTestApp } from '../support/api-harness';
import { appendAudit } from '../../server/audit/audit.service';
import { chainHash } from '../../server/audit/audit-chain';
import { AuditEvent } from '../../server/db/models';

// The chain head is locked, hashed, appended and moved by one statement in the database (audit_append):
// its hash must be the very one the app's verification computes, whatever the text holds.
const { sequelize } = startTestApp();
afterAll(() => sequelize.close());

const tag = `append-${process.pid}-${Date.now()}`;

async function rowsOf(entityId: string) {
  return AuditEvent.findAll({ where: { entityType: 'SpecAppend', entityId }, order: [['id', 'ASC']] });
}

/** The row's hash recomputed by the app from its stored columns, and its predecessor's hash by id. */
async function expectLinked(row: AuditEvent): Promise<void> {
  const before = await AuditEvent.findOne({ where: { id: { [Op.lt]: row.id } }, order: [['id', 'DESC']] });
  const content = {
    occurredAt: row.occurredAt.toISOString(),
    ...{ actorId: row.actorId, actorName: row.actorName, action: row.action, entityType: row.entityType },
    ...{ entityId: row.entityId, payload: row.payload, diff: row.diff, ip: row.ip },
  };
  expect(row.hash).toBe(chainHash(row.prevHash, content));
  if (before) expect(row.prevHash).toBe(before.hash);
}

describe('audit appends in one statement', () => {
  it('when an entry holds accents, emoji, quotes, backslashes, control signs and a long diff, then its hash verifies', async () => {
    // Arrange
    const actor = { id: null, name: 'Zoë "Ø" Ångström \\ 工程師 🛠', ip: 'fe80::1%eth0' };
    const payload = { note: 'line\nbreak\ttab \u0001 "quoted" \\ back', µ: 'Ω·m', list: [1.5, -0, 1e21] };
    const diff = `${'–Δ d = 60 → 61 mm\n'.repeat(12_000)}end`;

    // Act
    await appendAudit(sequelize, actor, {
      action: 'spec.append',
      entityType: 'SpecAppend',
      entityId: tag,
      payload,
      diff,
    });

    // Assert
    const [row] = await rowsOf(tag);
    expect(row.actorName).toBe(actor.name);
    expect(row.diff).toBe(diff);
    await expectLinked(row);
  });

  it('when twenty appends race, then each links to the row before it and the times rise with the ids', async () => {
    // Arrange
    const id = `${tag}-race`;

    // Act
    await Promise.all(
      Array.from({ length: 20 }, (_, n) =>
        appendAudit(
          sequelize,
          { id: null, name: `writer ${n}` },
          { action: 'spec.race', entityType: 'SpecAppend', entityId: id, payload: { n } },
        ),
      ),
    );

    // Assert
    const rows = await rowsOf(id);
    expect(rows).toHaveLength(20);
    for (const row of rows) await expectLinked(row);
    const times = rows.map((r) => r.occurredAt.getTime());
    expect(times).toEqual([...times].sort((a, b) => a - b));
  });

  it('when the transaction that appended rolls back, then its entry is gone', async () => {
    // Arrange
    const id = `${tag}-rollback`;

    // Act
    const t = await sequelize.transaction();
    await appendAudit(
      sequelize,
      { id: null, name: 'undone' },
      { action: 'spec.undone', entityType: 'SpecAppend', entityId: id },
      t,
    );
    await t.rollback();

    // Assert
    expect(await rowsOf(id)).toHaveLength(0);
  });
});
