import { startTestApp } from '../support/api-harness';
import { appendAudit } from '../../server/audit/audit.service';
import { chainHash } from '../../server/audit/audit-chain';
import { AuditEvent } from '../../server/db/models';

// A save's audit entry is its transaction's last statement: the database commits right after the append
// (audit_append_commit). The entry and the write it records must still commit together or not at all.
const { sequelize } = startTestApp();
afterAll(() => sequelize.close());

const tag = `append-commit-${process.pid}-${Date.now()}`;

const rowsOf = (entityId: string) =>
  AuditEvent.findAll({ where: { entityType: 'SpecAppendCommit', entityId }, order: [['id', 'ASC']] });

describe('an audit append that commits its transaction', () => {
  it('when the append succeeds, then the earlier write and the entry are both stored and the entry verifies', async () => {
    // Arrange
    const id = `${tag}-done`;
    const t = await sequelize.transaction();
    const actor = { id: null, name: 'committer' };
    await appendAudit(sequelize, actor, { action: 'spec.first', entityType: 'SpecAppendCommit', entityId: id }, t);

    // Act
    await appendAudit(
      sequelize,
      actor,
      { action: 'spec.last', entityType: 'SpecAppendCommit', entityId: id, payload: { n: 1 }, commits: true },
      t,
    );
    await t.commit();

    // Assert
    const rows = await rowsOf(id);
    expect(rows.map((r) => r.action)).toEqual(['spec.first', 'spec.last']);
    const last = rows[1];
    const content = {
      occurredAt: last.occurredAt.toISOString(),
      ...{ actorId: last.actorId, actorName: last.actorName, action: last.action, entityType: last.entityType },
      ...{ entityId: last.entityId, payload: last.payload, diff: last.diff, ip: last.ip },
    };
    expect(last.hash).toBe(chainHash(last.prevHash, content));
    expect(last.prevHash).toBe(rows[0].hash);
  });

  it('when the append fails, then nothing is committed and the earlier write rolls back', async () => {
    // Arrange: an action longer than its column (64 letters) makes the append itself fail.
    const id = `${tag}-failed`;
    const t = await sequelize.transaction();
    const actor = { id: null, name: 'failing' };
    await appendAudit(sequelize, actor, { action: 'spec.first', entityType: 'SpecAppendCommit', entityId: id }, t);

    // Act
    const failed = appendAudit(
      sequelize,
      actor,
      { action: 'x'.repeat(65), entityType: 'SpecAppendCommit', entityId: id, commits: true },
      t,
    );
    await expect(failed).rejects.toThrow();
    await t.rollback();

    // Assert
    expect(await rowsOf(id)).toHaveLength(0);
  });
});
