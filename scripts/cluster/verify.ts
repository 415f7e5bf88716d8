import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type { GaleraCluster, GaleraNode } from './galera';
import type { Ledger } from './signoff-steps';

const run = promisify(execFile);

/** Counts that every node must hold identically; compared across nodes after the run. */
const FINGERPRINT = `SELECT (SELECT COUNT(*) FROM calcs) calcs, (SELECT COUNT(*) FROM revisions) revisions,
  (SELECT COUNT(*) FROM signatures) signatures, (SELECT COUNT(*) FROM attachments) attachments,
  (SELECT COUNT(*) FROM mail_outbox) mails, (SELECT MAX(id) FROM audit_events) audit_last,
  (SELECT last_hash FROM audit_chain_head WHERE id = 1) chain_head`;

/**
 * The promises of a cluster run, checked on one node (a read that waits until the node has
 * applied every write the cluster committed: wsrep_sync_wait). Returns the problems found.
 */
export async function verifyNode(
  cluster: GaleraCluster,
  node: GaleraNode,
  db: string,
  projectId: number,
  ledger: Ledger,
): Promise<{ problems: string[]; fingerprint: string }> {
  const problems: string[] = [];
  const q = <T>(sql: string, params: unknown[] = []) => cluster.query<T>(node, sql, params, db);
  const expectNone = async (what: string, sql: string, params: unknown[] = []) => {
    const rows = await q<Record<string, unknown>>(sql, params);
    if (rows.length)
      problems.push(
        `${node.name}: ${what}: ${JSON.stringify(rows.slice(0, 3), (_k, v) => (typeof v === 'bigint' ? Number(v) : v))}`,
      );
  };

  const calcIds = ledger.calcs.map((c) => c.id);
  const [{ n }] = await q<{ n: bigint }>('SELECT COUNT(*) n FROM calcs WHERE id IN (?)', [calcIds]);
  if (Number(n) !== calcIds.length)
    problems.push(`${node.name}: ${calcIds.length - Number(n)} acknowledged calcs missing`);
  for (const s of ledger.saves) {
    const rows = await q<{ title: string }>("SELECT JSON_VALUE(input, '$.title') title FROM revisions WHERE id = ?", [
      s.revisionId,
    ]);
    if (rows[0]?.title !== s.title) problems.push(`${node.name}: acknowledged save of revision ${s.revisionId} lost`);
  }
  for (const a of ledger.attachments) {
    const [{ c }] = await q<{ c: bigint }>(
      'SELECT COUNT(*) c FROM attachments WHERE revision_id = ? AND file_name = ?',
      [a.revisionId, a.fileName],
    );
    if (Number(c) < 1) problems.push(`${node.name}: acknowledged upload ${a.fileName} lost`);
  }
  for (const s of ledger.signatures) {
    const [{ c }] = await q<{ c: bigint }>(
      'SELECT COUNT(*) c FROM signatures WHERE idempotency_key = ? AND revision_id = ? AND meaning = ?',
      [s.key, s.revisionId, s.meaning],
    );
    if (Number(c) !== 1)
      problems.push(`${node.name}: acknowledged ${s.meaning} signature on revision ${s.revisionId} found ${c} times`);
  }
  const scope = 'SELECT r.id FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE c.project_id = ?';
  await expectNone(
    'revision state does not match its signatures',
    `SELECT r.id, r.status, GROUP_CONCAT(s.meaning ORDER BY s.signed_at) signed
    FROM revisions r JOIN calcs c ON c.id = r.calc_id LEFT JOIN signatures s ON s.revision_id = r.id WHERE c.project_id = ? GROUP BY r.id, r.status
    HAVING NOT ((r.status = 'draft' AND signed IS NULL) OR (r.status = 'in_check' AND signed = 'authored')
      OR (r.status = 'checked' AND signed = 'authored,checked') OR (r.status = 'approved' AND signed = 'authored,checked,approved'))`,
    [projectId],
  );
  await expectNone(
    'idempotency key used more than once',
    'SELECT idempotency_key, COUNT(*) n FROM signatures GROUP BY idempotency_key HAVING n > 1',
  );
  await expectNone(
    'signature without exactly one audit entry',
    `SELECT s.id, s.meaning, (SELECT COUNT(*) FROM audit_events e WHERE e.entity_type = 'Revision'
    AND e.entity_id = CAST(s.revision_id AS CHAR) AND e.action = CONCAT('revision.signed_', s.meaning)) n FROM signatures s WHERE s.revision_id IN (${scope}) HAVING n <> 1`,
    [projectId],
  );
  await expectNone(
    'hand-over mail queued more than once',
    "SELECT subject, recipient, COUNT(*) n FROM mail_outbox WHERE subject LIKE '%Cluster run%' GROUP BY subject, recipient HAVING n > 1",
  );
  await expectNone(
    "list totals kept per project and state differ from the calcs' own states",
    `SELECT project_id, state, SUM(kept) kept, SUM(actual) actual FROM (
      SELECT project_id, state, n kept, 0 actual FROM calc_counts
      UNION ALL SELECT project_id, COALESCE(latest_status, ''), 0, 1 FROM calcs) x
    GROUP BY project_id, state HAVING SUM(kept) <> SUM(actual)`,
  );
  const [mails] = await q<{ n: bigint }>(
    "SELECT COUNT(DISTINCT subject) n FROM mail_outbox WHERE subject LIKE 'Approved:%Cluster run%'",
  );
  const approved = new Set(ledger.signatures.filter((s) => s.meaning === 'approved').map((s) => s.revisionId)).size;
  if (Number(mails.n) !== approved)
    problems.push(`${node.name}: ${approved} approvals but ${mails.n} approval mails queued`);
  const [fp] = await q<Record<string, unknown>>(FINGERPRINT);
  return { problems, fingerprint: JSON.stringify(fp, (_k, v) => (typeof v === 'bigint' ? Number(v) : v)) };
}

/** The app's own audit-chain verifier, run against one node directly (not through HAProxy). */
export async function verifyChainOn(
  node: GaleraNode,
  env: NodeJS.ProcessEnv,
): Promise<{ ok: boolean; checked: number; brokenAt?: number }> {
  const { stdout } = await run(process.execPath, ['--import', 'tsx', 'scripts/cluster/verify-chain.ts'], {
    env: { ...env, DB_HOST: '127.0.0.1', DB_PORT: String(node.port), DB_POOL_MAX: '1', LOG_LEVEL: 'silent' },
  });
  return JSON.parse(stdout.trim().split('\n').at(-1)!);
}
