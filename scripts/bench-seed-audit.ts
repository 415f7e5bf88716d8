// A million chained audit entries for the list benchmark: saves with their diffs, signatures,
// new calcs, sign-ins and findings, over ten years, each hashed onto the one before it.
import canonicalize from 'canonicalize';
import type { Connection } from 'mariadb';
import { chainHash, type ChainedContent } from '../server/audit/audit-chain';
import { BENCH, pick, prng } from './bench-seed-data';
import type { Person } from './bench-seed-names';
import type { Library } from './bench-seed-library';

const BATCH = 2_000;
const DIFF = [
  '--- A@3',
  '+++ A@4',
  '@@ -12,7 +12,7 @@',
  '     {',
  '       "length": 120,',
  '-      "od": 55,',
  '+      "od": 60,',
  '       "material": "EN 10083-2 C45E (QT)"',
  '     },',
].join('\n');

type Kind = [action: string, entityType: 'Revision' | 'Calc' | 'User', share: number];
const KINDS: Kind[] = [
  ['revision.saved', 'Revision', 0.5],
  ['revision.signed_authored', 'Revision', 0.08],
  ['revision.signed_checked', 'Revision', 0.06],
  ['revision.signed_approved', 'Revision', 0.06],
  ['calc.created', 'Calc', 0.1],
  ['auth.signed_in', 'User', 0.15],
  ['finding.raised', 'Revision', 0.05],
];

function kindOf(rnd: () => number): Kind {
  let x = rnd();
  for (const k of KINDS) if ((x -= k[2]) < 0) return k;
  return KINDS[0];
}

export async function seedAudit(conn: Connection, ctx: { people: Person[]; library: Library }): Promise<number> {
  const rnd = prng(34);
  const lib = ctx.library;
  const [head] = await conn.query('SELECT last_hash FROM audit_chain_head WHERE id = 1');
  const [{ next }] = await conn.query('SELECT COALESCE(MAX(id), 0) + 1 AS next FROM audit_events');
  let prev: string = head.last_hash;
  let id = Number(next);
  const start = Date.now() - 10 * 365.25 * 86_400_000;
  const step = (10 * 365.25 * 86_400_000) / BENCH.audit;
  for (let done = 0; done < BENCH.audit; done += BATCH) {
    const rows: unknown[][] = [];
    for (let i = done; i < Math.min(BENCH.audit, done + BATCH); i++) {
      const [action, entityType] = kindOf(rnd);
      const actor = pick(rnd, ctx.people);
      // Entries follow the library's growth: early entries touch early calcs.
      const revIndex = Math.floor((i / BENCH.audit) * (lib.revisions - 1));
      const k = lib.revisionCalc[revIndex];
      const calcId = lib.firstCalcId + k;
      const entityId =
        entityType === 'Revision' ? lib.firstRevisionId + revIndex : entityType === 'Calc' ? calcId : actor.id;
      const payload =
        entityType === 'User'
          ? { username: actor.username }
          : { calcId, revision: 'A', lockVersion: i % 9, verdict: 'pass', ruleSet: 'KFD-ENG-014 v3' };
      const content: ChainedContent = {
        occurredAt: new Date(start + i * step).toISOString(),
        actorId: actor.id,
        actorName: actor.displayName,
        action,
        entityType,
        entityId: String(entityId),
        payload: canonicalize(payload) ?? '{}',
        diff: action === 'revision.saved' ? DIFF : null,
        ip: '10.20.0.7',
      };
      const hash = chainHash(prev, content);
      const scoped = entityType !== 'User';
      rows.push([
        id++,
        new Date(content.occurredAt),
        content.actorId,
        content.actorName,
        action,
        entityType,
        content.entityId,
        content.payload,
        content.diff,
        content.ip,
        prev,
        hash,
        scoped ? calcId : null,
        scoped ? lib.calcProject[k] : null,
      ]);
      prev = hash;
    }
    // One multi-row statement per batch: the driver's bulk protocol was several times slower here.
    await conn.query(
      `INSERT INTO audit_events (id, occurred_at, actor_id, actor_name, action, entity_type, entity_id, payload, diff, ip, prev_hash, hash, calc_id, project_id)
      VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`,
      rows.flat(),
    );
    if ((done / BATCH) % 40 === 39)
      process.stdout.write(`  … ${(done + BATCH).toLocaleString('en-US')} audit entries\n`);
  }
  await conn.query('UPDATE audit_chain_head SET last_id = ?, last_hash = ? WHERE id = 1', [id - 1, prev]);
  return BENCH.audit;
}
