import { plainSelect } from '../db/plain-query';
import { z } from 'zod';
import type { SessionUser } from '../../shared/schemas/auth.schema';
import { cursorSchema } from '../../shared/schemas/common.schema';
import {
  QUEUE_KEYS,
  QUEUE_LABELS,
  type QueueDto,
  type QueueItem,
  type QueueKey,
} from '../../shared/schemas/queue.schema';
import type { RevisionState } from '../../shared/schemas/revision.schema';
import { QUEUES, WORKFLOW } from '../../shared/workflow/revision-states';
import type { Relation } from '../../shared/workflow/relations';
import { Calc } from '../db/models';
import {
  cappedCountSql,
  cappedTotal,
  decodeCursor,
  encodeCursor,
  keysetCondition,
  type KeyColumn,
} from '../http/keyset';
import { blindRevisionIds } from '../independent/blind-lists';
import { BLIND_STATES } from '../independent/blind';
import type { AppAbility } from '../../shared/authz/app-ability';
import { viewerOf } from '../independent/viewer';

export const queueQuerySchema = z.object({
  size: z.coerce.number().int().min(1).max(500).default(50),
  after: cursorSchema,
});
export type QueueQuery = z.infer<typeof queueQuerySchema>;

// A queue is a filter on the calcs' summary columns (only a calc's newest revision can wait for anyone),
// oldest first by when it entered its state; indexes calcs_author_state and calcs_state_since serve them.
const KEY: KeyColumn[] = [{ sql: 'c.latest_since', isDate: true }, { sql: 'c.id' }];

/**
 * No editor row of the reader for the calc: a look-up by primary key per candidate the walk reaches. Written as
 * `NOT EXISTS (…)`, MariaDB turned it into an anti-join that first gathered every calc the reader ever edited (980 for
 * a checker of the bench's library) on each read: the overview's statement 0.90 → 0.67 ms alone, the queue of calcs
 * waiting for a check 0.63 → 0.40 ms.
 */
const NOT_EDITED_BY = '(SELECT COUNT(*) FROM calc_editors e WHERE e.calc_id = c.id AND e.user_id = ?) = 0';
type Filter = { sql: string; params: unknown[] };

// How each relation of the workflow table (shared/workflow/relations.ts) reads on the calcs' summary columns.
const RELATION_SQL: Record<Relation, (userId: number) => Filter> = {
  own: (userId) => ({ sql: 'c.latest_author_id = ?', params: [userId] }),
  independent: (userId) => ({ sql: NOT_EDITED_BY, params: [userId] }),
  'independent-of-checker': (userId) => ({
    sql: `c.latest_checker_id <> ? AND ${NOT_EDITED_BY}`,
    params: [userId, userId],
  }),
};

/** A queue lists the calcs whose newest revision waits in its state for someone standing to it as the turn asks. */
function turnOf(key: QueueKey) {
  const { state } = QUEUES.find((q) => q.key === key)!;
  return { state, turn: WORKFLOW[state].turn! };
}

/** The queue's rows as a filter on the calcs' summary columns. */
export function filterOf(key: QueueKey, userId: number): Filter {
  const { state, turn } = turnOf(key);
  const relation = RELATION_SQL[turn.relation](userId);
  return { sql: `c.latest_status = ? AND ${relation.sql}`, params: [state, ...relation.params] };
}

/**
 * How many calcs wait in a queue, as one SQL expression. A queue of someone else's calcs is counted exactly, from the
 * per-state counts the triggers keep (`calc_counts`) less the calcs of that state its reader may not take: those they
 * edited, and for the approvers' turn also those they checked or that name no checker (`latest_checker_id <> ?` is
 * not true for them). Each of those is a short index range (editor rows carry their calc's state); counting the queue
 * itself read every waiting calc (up to a cap) with a lookup in `calc_editors` each. An author's own queue is an
 * index range already, counted up to the cap (`exact: false`).
 */
export function queueCountSql(key: QueueKey, userId: number): Filter & { exact: boolean } {
  const { state, turn } = turnOf(key);
  if (turn.relation === 'own') {
    const f = filterOf(key, userId);
    return { sql: cappedCountSql(`FROM calcs c WHERE ${f.sql}`), params: f.params, exact: false };
  }
  const inState = '(SELECT COALESCE(SUM(k.n), 0) FROM calc_counts k WHERE k.state = ?)';
  // Editor rows carry their calc's latest state (migrations/20261231-14-calc-editor-states.ts).
  const edited = 'SELECT e.calc_id FROM calc_editors e WHERE e.user_id = ? AND e.latest_status = ?';
  if (turn.relation === 'independent')
    return {
      sql: `(${inState} - (SELECT COUNT(*) FROM (${edited}) x))`,
      params: [state, userId, state],
      exact: true,
    };
  const notTheirs = `SELECT c.id FROM calcs c WHERE (c.latest_checker_id IS NULL OR c.latest_checker_id = ?)
    AND c.latest_status = ?`;
  return {
    sql: `(${inState} - (SELECT COUNT(*) FROM (${notTheirs} UNION ${edited}) x))`,
    params: [state, userId, state, userId, state],
    exact: true,
  };
}

/** The queues a person's roles give them: those whose state waits for one of their roles. */
export const queueKeysOf = (user: SessionUser): QueueKey[] =>
  QUEUE_KEYS.filter((k) => user.roles.includes(turnOf(k).turn.role));

interface Row {
  id: number;
  latest_revision_id: number;
  project_code: string;
  number: string;
  title: string;
  latest_label: string;
  latest_status: RevisionState;
  latest_verdict: string | null;
  author_name: string;
  latest_since: Date;
  latest_author_id: number;
  latest_rule_set_id: number;
  /** Read only for a reader who may check: the standard's lock version and their own locked model (blind-lists.ts). */
  rule_set_version?: number;
  own_model_locked?: number;
}

const toItem = (r: Row): QueueItem => ({
  calcId: r.id,
  revisionId: r.latest_revision_id,
  projectCode: r.project_code,
  number: r.number,
  title: r.title,
  revision: r.latest_label,
  status: r.latest_status,
  verdict: r.latest_verdict,
  authorName: r.author_name,
  since: new Date(r.latest_since).toISOString(),
});

type QueueRows = { rows: Row[]; counted: { total: number; totalIsAtLeast: boolean } | null };

const COLUMNS = `c.id, c.latest_revision_id, c.project_code, c.number, c.title, c.latest_label, c.latest_status,
  c.latest_verdict, c.author_name, c.latest_since, c.latest_author_id, c.latest_rule_set_id`;

// What decides a blind verdict (blind-lists.ts), read with the rows of a queue that may hold someone else's calc in a
// blind state when the reader may check: the standard's lock version and whether the reader's own model of the
// revision is locked; two statements fewer per answer. As subqueries on the page's own rows (a join inside each
// part, or around the whole union, cost MariaDB more than the two statements saved).
const BLIND_FACTS = `(SELECT rs.lock_version FROM rule_sets rs WHERE rs.id = c.latest_rule_set_id) AS rule_set_version,
  EXISTS (SELECT 1 FROM independent_models m WHERE m.revision_id = c.latest_revision_id AND m.checker_id = ?
    AND m.locked_at IS NOT NULL) AS own_model_locked`;
const NO_FACTS = 'NULL AS rule_set_version, NULL AS own_model_locked';

/** Whether a queue's rows need the blind facts: someone else's calcs, in a state whose verdict may be hidden. */
function needsFacts(key: QueueKey, mayCheck: boolean): boolean {
  const { state, turn } = turnOf(key);
  return mayCheck && turn.relation !== 'own' && BLIND_STATES.includes(state);
}

/**
 * One page of each of these queues (and one more row, to know there is a next page), with each queue's capped count
 * on a first page, in one statement: each part reads its own index range, and a first page's rows carry their queue's
 * count (a subquery that does not depend on the row, so MariaDB runs it once); a queue with no row on its first page
 * has none waiting. A statement per page and per count cost the app more than reading the rows.
 */
async function queueRows(
  user: SessionUser,
  ability: AppAbility,
  keys: QueueKey[],
  query: QueueQuery,
): Promise<QueueRows[]> {
  const { mayCheck } = viewerOf(ability);
  const filters = keys.map((key) => filterOf(key, user.id));
  const keyset = query.after
    ? keysetCondition(KEY, decodeCursor(query.after, KEY), 'asc')
    : { sql: 'TRUE', replacements: [] };
  const facts = keys.map((key) => needsFacts(key, mayCheck));
  const counts = keys.map((key) => queueCountSql(key, user.id));
  const count = (i: number) => (query.after ? 'NULL AS n' : `${counts[i].sql} AS n`);
  const pages = filters.map(
    (f, i) => `(SELECT ${i} AS q, ${COLUMNS}, ${facts[i] ? BLIND_FACTS : NO_FACTS}, ${count(i)} FROM calcs c
      WHERE ${f.sql} AND ${keyset.sql} ORDER BY c.latest_since ASC, c.id ASC LIMIT ${query.size + 1})`,
  );
  const replacements = filters.flatMap((f, i) => [
    ...(facts[i] ? [user.id] : []),
    ...(query.after ? [] : counts[i].params),
    ...f.params,
    ...keyset.replacements,
  ]);
  const rows = await plainSelect<Row & { q: number; n: number | null }>(
    Calc.sequelize!,
    `${pages.join(' UNION ALL ')} ORDER BY q, latest_since, id`,
    replacements,
  );
  return keys.map((_, i) => {
    const own = rows.filter((r) => Number(r.q) === i);
    const n = Number(own[0]?.n ?? 0);
    if (query.after) return { rows: own, counted: null };
    return { rows: own, counted: counts[i].exact ? { total: n, totalIsAtLeast: false } : cappedTotal(n) };
  });
}

/** The revisions among these pages whose verdict this person may not see yet (a blind check), asked once. */
function blindOf(ability: AppAbility, pages: QueueRows[], size: number): Promise<Set<number>> {
  return blindRevisionIds(
    ability,
    pages.flatMap((p) =>
      p.rows.slice(0, size).map((r) => ({
        revisionId: r.latest_revision_id,
        ruleSetId: r.latest_rule_set_id,
        authorId: r.latest_author_id,
        status: r.latest_status,
        known:
          r.rule_set_version == null
            ? undefined
            : { ruleSetVersion: Number(r.rule_set_version), ownModelLocked: Boolean(Number(r.own_model_locked)) },
      })),
    ),
  );
}

function queueDto(key: QueueKey, { rows, counted }: QueueRows, size: number, blind: Set<number>): QueueDto {
  const items = rows.slice(0, size);
  const last = items[items.length - 1];
  return {
    key,
    label: QUEUE_LABELS[key],
    items: items.map((r) => toItem(blind.has(r.latest_revision_id) ? { ...r, latest_verdict: null } : r)),
    total: counted?.total ?? null,
    totalIsAtLeast: counted?.totalIsAtLeast ?? false,
    size,
    next: rows.length > size ? encodeCursor([new Date(last.latest_since).toISOString(), last.id]) : null,
  };
}

/** One page of one queue, oldest first; counted (up to a cap) only on its first page. */
export async function queuePage(
  user: SessionUser,
  ability: AppAbility,
  key: QueueKey,
  query: QueueQuery,
): Promise<QueueDto> {
  const [page] = await queueRows(user, ability, [key], query);
  return queueDto(key, page, query.size, await blindOf(ability, [page], query.size));
}

/**
 * The first page of every queue this person's roles give them, read together; whose verdicts stay hidden is then
 * decided once for all of them (it was a standards read and a models read per queue).
 */
export async function queuesOf(user: SessionUser, ability: AppAbility, query: QueueQuery): Promise<QueueDto[]> {
  const keys = queueKeysOf(user);
  if (!keys.length) return [];
  const pages = await queueRows(user, ability, keys, { size: query.size });
  const blind = await blindOf(ability, pages, query.size);
  return keys.map((key, i) => queueDto(key, pages[i], query.size, blind));
}
