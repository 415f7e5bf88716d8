import { evaluateValidInput } from '../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, type RuleSet } from '../../shared/rules';
import { evaluateChecklist } from '../../shared/rules/reference-checklist';
import { nonFinitePath } from '../../shared/json/finite-json';
import { computeRecord } from '../../server/calcs/revision-content';
import { stored } from '../../server/calcs/calcs.service';
import { loadRuleSet } from '../../server/rule-sets/rule-set-cache';
import { signingBlocker } from '../../server/workflow/independence';
import { Revision } from '../../server/db/models';
import { startTestApp } from '../support/api-harness';
import { calcTeam, effectiveRuleSetId, fixtureInput, revisionOf, sign } from '../support/calc-harness';

// Defence in depth for the worst fault a signed record can have: a shaft that cannot be computed
// reading "compliant". Whatever the engine accepts, nothing non-finite is stored, a clause that
// cannot be evaluated is an error row, and an error row cannot be signed.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Json = Record<string, unknown> | unknown[];
function numberPaths(v: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (typeof v === 'number') return [path];
  if (!v || typeof v !== 'object') return [];
  return Object.entries(v).flatMap(([k, x]) => numberPaths(x, [...path, Array.isArray(v) ? Number(k) : k]));
}
function mutate(input: Json, path: (string | number)[], value: number): Json {
  const copy = structuredClone(input);
  let at: Record<string | number, unknown> = copy as Record<string, unknown>;
  for (const k of path.slice(0, -1)) at = at[k] as Record<string | number, unknown>;
  at[path[path.length - 1]] = value;
  return copy;
}

let doc: RuleSet;
beforeAll(async () => {
  ({ doc } = await loadRuleSet(await effectiveRuleSetId()));
});

describe('single-number mutations of valid calcs', () => {
  it.each(['five-segment-fatigue', 'stepped-us', 'hollow-si'])(
    'when each number of %s becomes 1e200, 1e-200, 0, -x or 1e308, then nothing non-finite is stored and no compliant verdict rests on an error row',
    async (name) => {
      const input = fixtureInput(name);
      let probes = 0;
      for (const path of numberPaths(input)) {
        const x = path.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], input) as number;
        for (const value of [1e200, 1e-200, 0, -x, 1e308]) {
          const computed = await computeRecord(mutate(input, path, value), doc);
          const where = `${path.join('.')} = ${value}`;
          expect([where, nonFinitePath(computed.result), nonFinitePath(computed.checklist)]).toEqual([
            where,
            null,
            null,
          ]);
          expect(() => stored(computed)).not.toThrow();
          if (computed.verdict === 'compliant') {
            expect([where, computed.checklist!.rows.filter((r) => r.status === 'error').length]).toEqual([where, 0]);
          }
          if (computed.result === null)
            expect([where, computed.verdict, computed.inputIssues.length > 0]).toEqual([where, null, true]);
          probes++;
        }
      }
      expect(probes).toBeGreaterThan(50);
    },
  );
});

describe('clauses on facts that are not finite', () => {
  it('when a segment fact is Infinity, then each clause reading it is an error row there, never not-applicable or a pass, in both evaluators', async () => {
    const input = applyRuleSetMethods(fixtureInput() as never, doc);
    const result = evaluateValidInput(input);
    result.segments[1].tauMax = Infinity;
    result.segments[1].yieldSafety = Number.NaN;
    const async = await evaluateChecklist(input, result, doc);
    const sync = evaluateChecklistSync(input, result, doc);
    expect(sync).toEqual(async);
    const onSegment = async.rows.filter((r) => r.location.scope === 'segment' && r.location.index === 1);
    const reading = onSegment.filter((r) => r.status === 'error');
    expect(reading.length).toBeGreaterThan(0);
    for (const r of reading) expect(r.message).toMatch(/is not a finite number/);
    expect(async.verdict).toBe('not-compliant');
  });
});

describe('signing', () => {
  it('when a saved segment has od 1e200, then nothing non-finite is stored, the verdict is not compliant and the revision cannot be signed', async () => {
    const team = await calcTeam(app);
    const r = await revisionOf(team.author.session, team.revisionId);
    const input = structuredClone(r.input);
    input.segments[0].od = 1e200;
    const saved = await team.author.session.put(`/api/revisions/${team.revisionId}`, {
      input,
      lockVersion: r.lockVersion,
    });
    expect(saved.status).toBe(200);
    expect(saved.body.verdict).not.toBe('compliant');
    const row = (await Revision.findByPk(team.revisionId))!;
    expect(row.verdict).not.toBe('compliant');
    // Out of range (and od⁴ would overflow J): no result is stored, never one with nulls.
    expect([row.result, row.checklist, row.verdict]).toEqual([null, null, null]);
    // The engine refuses the value itself (plausible ranges); the server's guard stands behind it.
    expect(saved.body.inputIssues).toEqual([
      expect.objectContaining({ path: expect.stringMatching(/^segments\[0\]/) }),
    ]);
    const signed = await sign(team.author.session, team.revisionId, 'authored');
    expect(signed.status).toBe(403);
  });

  it.each(['authored', 'checked', 'approved'] as const)(
    'when a checklist has an error row, then signing as %s is refused even with a compliant verdict',
    (meaning) => {
      const state = { authored: 'draft', checked: 'in_check', approved: 'checked' } as const;
      const blocker = signingBlocker(meaning, {
        actor: { id: 9, roles: ['author', 'checker', 'approver'] },
        revision: {
          status: state[meaning],
          authorId: meaning === 'authored' ? 9 : 1,
          checkerId: 2,
          hasResult: true,
          verdict: 'compliant',
          errorRows: 1,
        },
        editorIds: [],
        openFindings: 0,
        unresolvedFindings: 0,
        openManualItems: 0,
      });
      expect(blocker).toMatch(/could not be evaluated/);
    },
  );
});
