import { QueryTypes, type Sequelize } from 'sequelize';
import type { SignalRow } from '../../shared/schemas/review-health.schema';
import { startTestApp, expectStatus, person, type Session } from '../support/api-harness';
import { advanceTo, calcTeam, sign, tickAll } from '../support/calc-harness';
import { daysAgo, today } from '../support/health-harness';
import { appendAudit } from '../../server/audit/audit.service';

// The refusals signal reads per-day sums a trigger keeps beside the audit trail (migration 20261231-08): whatever
// appends a refused attempt, the sums must say what the entries themselves say.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

let compliance: Session;
let team: Awaited<ReturnType<typeof calcTeam>>;

beforeAll(async () => {
  compliance = (await person(app, ['compliance'], 'rd-compliance')).session;
  team = await calcTeam(app);
  const sessions = { author: team.author.session, checker: team.checker.session, approver: team.approver.session };
  await advanceTo('in_check', sessions, team.revisionId);
  await tickAll(team.checker.session, team.revisionId);
});

/** The project's refused attempts grouped from the audit entries themselves, as the signal grouped them before. */
const fromTrail = (projectId: number) =>
  (sequelize as Sequelize).query(
    `SELECT actor_id AS actorId, entity_id AS entityId, COUNT(*) AS attempts, MIN(occurred_at) AS first,
       MAX(occurred_at) AS last, SUM(JSON_VALUE(payload, '$.reason') = 'wrong password') AS wrongPassword
     FROM audit_events WHERE action = 'revision.signature_refused' AND project_id = ? GROUP BY actor_id, entity_id`,
    { replacements: [projectId], type: QueryTypes.SELECT },
  );
const fromDays = (projectId: number) =>
  (sequelize as Sequelize).query(
    `SELECT actor_id AS actorId, entity_id AS entityId, SUM(attempts) AS attempts, MIN(first_at) AS first,
       MAX(last_at) AS last, SUM(IF(reason = 'wrong password', attempts, 0)) AS wrongPassword
     FROM signing_refusal_days WHERE project_id = ? GROUP BY actor_id, entity_id`,
    { replacements: [projectId], type: QueryTypes.SELECT },
  );
const numbers = (rows: object[]) =>
  JSON.parse(JSON.stringify(rows, (_k, v) => (typeof v === 'string' && /^\d+$/.test(v) ? Number(v) : v)));

async function refusals(): Promise<SignalRow[]> {
  const res = await compliance.get(
    `/api/review-health/signals/refusals?projectId=${team.project.id}&from=${daysAgo(1)}&to=${today()}`,
  );
  expect(res.status).toBe(200);
  return res.body.rows;
}

describe('refused signing attempts summed per day', () => {
  it('when a checker is refused twice through the signing path, then the day sums say what the audit entries say', async () => {
    // Act
    for (let i = 0; i < 2; i++)
      expectStatus(
        await sign(team.checker.session, team.revisionId, 'checked', { password: 'not the password' }),
        400,
        'refused',
      );

    // Assert
    expect(numbers(await fromDays(team.project.id))).toEqual(numbers(await fromTrail(team.project.id)));
    const rows = await refusals();
    expect(rows).toHaveLength(1);
    expect(rows[0].fact).toMatch(/^2 signing attempts refused \(wrong password ×2\) (between|at) /);
  });

  it('when a refusal is appended with a reason from before the codes were told apart, then it is counted under that reason', async () => {
    // Arrange
    const checker = { id: team.checker.user.id, name: team.checker.user.username };

    // Act
    await appendAudit(sequelize as Sequelize, checker, {
      action: 'revision.signature_refused',
      entityType: 'Revision',
      entityId: team.revisionId,
      payload: { meaning: 'checked', reason: 'one-time code missing or wrong' },
    });

    // Assert
    expect(numbers(await fromDays(team.project.id))).toEqual(numbers(await fromTrail(team.project.id)));
    const [row] = await refusals();
    expect(row.fact).toMatch(
      /^(Repeated: )?3 signing attempts refused \(wrong password ×2, one-time code missing or wrong ×1\) (between|at) /,
    );
  });
});
