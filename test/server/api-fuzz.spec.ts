import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import { verifyAuditChain } from '../../server/audit/audit.service';
import { signedInAs, startTestApp } from '../support/api-harness';
import { calcTeam, effectiveRuleSetId } from '../support/calc-harness';
import { stateChangingRoutes, type RouteInfo } from '../support/route-list';

/*
 * Malformed bodies for every state-changing route, found from the router stack. For each request:
 * never a 5xx, and a refused request (4xx) leaves the stored state of the fixtures unchanged. At the
 * end the audit chain verifies and no prototype was polluted. Bounded: FUZZ_RUNS generated bodies
 * per route (default 4) besides the fixed hostile ones.
 */
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

const RUNS = Number(process.env.FUZZ_RUNS ?? 4);

const FIELDS = [
  'input',
  'lockVersion',
  'password',
  'meaning',
  'idempotencyKey',
  'text',
  'answer',
  'reason',
  'reasonForChange',
  'done',
  'note',
  'document',
  'effectiveDate',
  'fromId',
  'revisionId',
  'projectId',
  'number',
  'title',
  'ruleSetId',
  'username',
  'displayName',
  'email',
  'roles',
  'active',
  'version',
  'code',
  'name',
  'status',
  'currentPassword',
  'newPassword',
  'oneTimeCode',
  'kind',
  'clauseRef',
];
const oddNumber = fc.constantFrom(1e308, -1e308, 5e-324, 0, -0, 2 ** 53 + 1, -1, 1e200, 0.5);
const leaf = fc.oneof(
  fc.jsonValue({ maxDepth: 2 }),
  oddNumber,
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.constantFrom('\ud800', '', 'x'.repeat(5000)),
);
type Body = { raw: string } | { json: unknown };
const body: fc.Arbitrary<Body> = fc.oneof(
  fc.dictionary(fc.constantFrom(...FIELDS), leaf, { maxKeys: 6 }).map((json) => ({ json })),
  fc.jsonValue({ maxDepth: 4 }).map((json) => ({ json })),
  fc.string({ maxLength: 120 }).map((raw) => ({ raw })),
);

const DEEP = `${'['.repeat(5000)}${']'.repeat(5000)}`;
const HOSTILE: Body[] = [
  { raw: '{"__proto__":{"polluted":true},"lockVersion":0}' },
  { raw: '{"constructor":{"prototype":{"polluted":true}}}' },
  { raw: '{"lockVersion":1e309,"input":{"segments":[{"od":-1e309}]},"text":1e400}' },
  { raw: `{"input":${DEEP},"document":${DEEP}}` },
  { raw: '{"text":"\\udc00 finding","reason":"\\ud800 reason","name":"\\ud83d"}' },
  { raw: '{"lockVersion":0,"lockVersion":1}' },
  { raw: '' },
  { raw: 'null' },
  { raw: '[]' },
  { raw: '{"a":' },
];

interface Fixtures {
  ids: Record<string, number>;
  userIds: number[];
  projectId: number;
  ruleSetDraftId: number;
}

const byId = (rows: object[]) =>
  [...rows].sort((a, b) => Number((a as { id: number }).id) - Number((b as { id: number }).id));

/** The stored rows the fixtures own, as one string: equal strings mean nothing changed. */
async function snapshot(f: Fixtures): Promise<string> {
  const q = (sql: string, replacements: unknown[]) =>
    sequelize.query(sql, { type: QueryTypes.SELECT, replacements }).catch((e) => {
      throw new Error(
        `snapshot query failed: ${sql}: ${e?.name} ${e?.message} ${e?.parent?.code} ${e?.parent?.sqlMessage}`,
      );
    });
  const revisionIds = '(SELECT r.id FROM revisions r JOIN calcs c ON c.id = r.calc_id WHERE c.project_id = ?)';
  const parts = await Promise.all([
    q('SELECT * FROM users WHERE id IN (?) ORDER BY id', [f.userIds]),
    q('SELECT * FROM user_roles WHERE user_id IN (?) ORDER BY user_id, role', [f.userIds]),
    q('SELECT * FROM projects WHERE id = ?', [f.projectId]),
    q('SELECT * FROM calcs WHERE project_id = ? ORDER BY id', [f.projectId]),
    // Rows with long text are ordered here, not by the server (a filesort of long rows can run out of sort memory).
    q(`SELECT * FROM revisions WHERE id IN ${revisionIds}`, [f.projectId]).then(byId),
    q(`SELECT * FROM findings WHERE revision_id IN ${revisionIds} ORDER BY id`, [f.projectId]),
    q(`SELECT * FROM signatures WHERE revision_id IN ${revisionIds} ORDER BY id`, [f.projectId]),
    q(`SELECT * FROM attachments WHERE revision_id IN ${revisionIds} ORDER BY id`, [f.projectId]),
    q('SELECT * FROM rule_sets WHERE id = ? OR created_by IN (?)', [f.ruleSetDraftId, f.userIds]).then(byId),
    q('SELECT * FROM mail_preferences WHERE user_id IN (?) ORDER BY user_id', [f.userIds]),
    // A refused signature or sign-in is audited on purpose; anything else refused must leave no entry.
    q(
      "SELECT COUNT(*) AS n, MAX(id) AS last FROM audit_events WHERE actor_id IN (?) AND action NOT LIKE '%refused' AND action NOT LIKE '%failed'",
      [f.userIds],
    ),
  ]);
  return JSON.stringify(parts);
}

function urlOf(route: RouteInfo, f: Fixtures): string {
  // Each area's :id is a real record of the fixtures; other ids still reach the route (404 or 400).
  const area = /^\/api\/([a-z-]+)/.exec(route.path)?.[1] ?? '';
  return route.path.replace(':id', String(f.ids[area] ?? f.ids.revisions)).replace(':itemId', 'fuzz-item');
}

// Logout ends the fuzzing session: it goes last.
const ordered = (routes: RouteInfo[]) =>
  [...routes].sort((a, b) => Number(a.path.endsWith('/logout')) - Number(b.path.endsWith('/logout')));

describe('API fuzz', () => {
  it('when every state-changing route gets malformed bodies, then none answers 5xx, refused ones change nothing, and the audit chain verifies', async () => {
    const team = await calcTeam(app);
    const fuzzer = await signedInAs(app, ['author', 'checker', 'approver', 'compliance', 'admin'], 'fuzz');
    const draft = await fuzzer.session.post('/api/rule-sets', { fromId: await effectiveRuleSetId() });
    expect(draft.status).toBe(201);
    const f: Fixtures = {
      ids: {
        users: team.author.user.id,
        projects: team.project.id,
        calcs: team.calc.id,
        revisions: team.revisionId,
        'rule-sets': draft.body.id,
      },
      userIds: [fuzzer.user.id, team.author.user.id, team.checker.user.id, team.approver.user.id],
      projectId: team.project.id,
      ruleSetDraftId: draft.body.id,
    };
    const routes = ordered(stateChangingRoutes(app));
    expect(routes.length).toBeGreaterThan(25);
    const s = fuzzer.session;
    let baseline = await snapshot(f);
    let sent = 0;

    const send = async (route: RouteInfo, b: Body) => {
      const req = s.agent[route.method](urlOf(route, f))
        .set('x-csrf-token', s.csrf)
        .set('Content-Type', 'application/json');
      const res = await req.send('raw' in b ? b.raw : (JSON.stringify(b.json) ?? ''));
      sent++;
      const what = `${route.method.toUpperCase()} ${route.path} ${JSON.stringify(b).slice(0, 300)}`;
      expect([what, res.status < 500 ? 'no 5xx' : `${res.status} ${JSON.stringify(res.body)}`]).toEqual([
        what,
        'no 5xx',
      ]);
      const after = await snapshot(f);
      if (res.status >= 400) expect([what, after]).toEqual([what, baseline]);
      baseline = after;
    };

    for (const route of routes) {
      for (const b of HOSTILE) await send(route, b);
      await fc.assert(
        fc.asyncProperty(body, (b) => send(route, b)),
        { numRuns: RUNS },
      );
    }
    expect(sent).toBeGreaterThanOrEqual(routes.length * HOSTILE.length);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(await verifyAuditChain()).toEqual(expect.objectContaining({ ok: true }));
  });
});
