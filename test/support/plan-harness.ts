import canonicalize from 'canonicalize';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { chainHash, type ChainedContent } from '../../server/audit/audit-chain';
import { runTransaction } from '../../server/db/transaction';
import { createTestProject, createTestUser } from './api-harness';
import { effectiveRuleSetId } from './calc-harness';

export const PLAN_CALCS = 3_000;
export const PLAN_AUDIT = 20_000;
const PLAN_AUDIT_BATCH = 1_000;
const PLAN_PROJECTS = 30;

/**
 * Enough rows for MariaDB's optimizer to weigh an index against a full scan the way it would on a
 * real library: 3,000 calcs with three revisions each (drafts and approved ones, by an author of
 * their own, so no one else's queue fills up) and 20,000 audit entries appended to the real chain.
 */
export async function seedPlanRows(
  sequelize: Sequelize,
): Promise<{ projectId: number; calcId: number; authorId: number }> {
  // Spread over projects and people as a library is, so that one project's rows are a small share.
  const projects = await Promise.all(Array.from({ length: PLAN_PROJECTS }, () => createTestProject()));
  const authors = await Promise.all(Array.from({ length: 10 }, () => createTestUser(['author'], 'plan-author')));
  const author = authors[0];
  const project = projects[0];
  const ruleSetId = await effectiveRuleSetId();
  const q = (sql: string, replacements: unknown[] = []) => sequelize.query(sql, { replacements });
  for (const [i, p] of projects.entries()) {
    await q(
      `INSERT INTO calcs (project_id, number, title, part_ref, created_by, created_at, updated_at)
      SELECT ?, CONCAT('P-', seq), CONCAT('Plan shaft ', seq), CONCAT('DRG-', seq), ?, UTC_TIMESTAMP(3), UTC_TIMESTAMP(3) FROM seq_1_to_${PLAN_CALCS / PLAN_PROJECTS}`,
      [p.id, authors[i % authors.length].id],
    );
  }
  // Revisions come from the listed ids: an INSERT that reads calcs cannot fire the trigger that writes calcs.
  const calcs = await sequelize.query<{ id: number; project_id: number; created_by: number }>(
    'SELECT id, project_id, created_by FROM calcs WHERE project_id IN (?) ORDER BY id',
    { replacements: [projects.map((p) => p.id)], type: QueryTypes.SELECT },
  );
  for (let i = 0; i < calcs.length; i += 500) {
    const rows = calcs
      .slice(i, i + 500)
      .flatMap((c) =>
        [0, 1, 2].map((seq) => [
          c.id,
          seq,
          String.fromCharCode(65 + seq),
          ['superseded', 'approved', 'draft'][seq],
          c.created_by,
          ruleSetId,
        ]),
      );
    await q(
      `INSERT INTO revisions (calc_id, seq, label, status, author_id, rule_set_id, input, manual_items, reason_for_change, created_at, updated_at)
      VALUES ${rows.map(() => "(?, '{}', '{}', 'plan', UTC_TIMESTAMP(3), UTC_TIMESTAMP(3))").join(', ')}`,
      rows,
    );
  }
  const calc = calcs.find((c) => c.project_id === project.id)!;
  await appendPlanAudit(sequelize, calcs);
  await q('ANALYZE TABLE calcs, revisions, audit_events');
  return { projectId: project.id, calcId: calc.id, authorId: author.id };
}

// Appended under the chain head's lock with correct hashes, so the chain still verifies for every other spec. Each
// batch of 1,000 is a transaction of its own: holding the head for all 20,000 made every audited write in the other
// spec files (a sign-in, a signature) wait for it.
async function appendPlanAudit(
  sequelize: Sequelize,
  calcs: { id: number; project_id: number; created_by: number }[],
): Promise<void> {
  for (let from = 0; from < PLAN_AUDIT; from += PLAN_AUDIT_BATCH) {
    await runTransaction(sequelize, (transaction) => appendBatch(sequelize, calcs, from, transaction));
  }
}

async function appendBatch(
  sequelize: Sequelize,
  calcs: { id: number; project_id: number; created_by: number }[],
  from: number,
  transaction: Transaction,
): Promise<void> {
  const [head] = await sequelize.query<{ last_hash: string }>(
    'SELECT last_hash FROM audit_chain_head WHERE id = 1 FOR UPDATE',
    { type: QueryTypes.SELECT, transaction },
  );
  let prev = head.last_hash;
  const rows: unknown[] = [];
  for (let i = from; i < from + PLAN_AUDIT_BATCH; i++) {
    const { id: calcId, project_id: projectId, created_by: actorId } = calcs[i % calcs.length];
    const content: ChainedContent = {
      occurredAt: new Date().toISOString(),
      actorId,
      actorName: 'Plan author',
      action: 'revision.saved',
      entityType: 'Calc',
      entityId: String(calcId),
      payload: canonicalize({ i }) ?? '{}',
      diff: null,
      ip: null,
    };
    const hash = chainHash(prev, content);
    rows.push([
      new Date(content.occurredAt),
      actorId,
      content.actorName,
      content.action,
      content.entityType,
      content.entityId,
      content.payload,
      prev,
      hash,
      calcId,
      projectId,
    ]);
    prev = hash;
  }
  await sequelize.query(
    `INSERT INTO audit_events (occurred_at, actor_id, actor_name, action, entity_type, entity_id, payload, prev_hash, hash, calc_id, project_id) VALUES ${rows.map(() => '(?)').join(', ')}`,
    { replacements: rows, transaction },
  );
  // No one else appends while the head is held, so the largest id is this batch's last.
  const [last] = await sequelize.query<{ id: number }>('SELECT MAX(id) AS id FROM audit_events', {
    type: QueryTypes.SELECT,
    transaction,
  });
  await sequelize.query('UPDATE audit_chain_head SET last_id = ?, last_hash = ? WHERE id = 1', {
    replacements: [last.id, prev],
    transaction,
  });
}
