import request from 'supertest';
import type { Sequelize } from 'sequelize';
import type { Express } from 'express';
import type { HealthReport, SignalKey, SignalRow } from '../../shared/schemas/review-health.schema';
import type { Role } from '../../shared/authz/roles';
import { signedInAs, startTestApp, person, type Session } from '../support/api-harness';
import { daysAgo, healthScenario, today } from '../support/health-harness';
import { AuditEvent } from '../../server/db/models';

let app: Express;
let sequelize: Sequelize;
let scenario: Awaited<ReturnType<typeof healthScenario>>;
let compliance: Session;
let report: HealthReport;

const SETTINGS = {
  quickCheckSecondsPerItem: 20,
  silentCheckerChecks: 2,
  pairingSharePercent: 75,
  pairingMinChecks: 2,
  refusalRepeatCount: 3,
  replacedWithinDays: 30,
};
const rowsOf = (key: SignalKey): SignalRow[] => report.signals.find((s) => s.key === key)!.rows;
// Fixed once the scenario is built, so a run that passes midnight (UTC) reads and expects the same period.
let period: { from: string; to: string };
const query = () => `projectId=${scenario.project.id}&from=${period.from}&to=${period.to}`;

beforeAll(async () => {
  ({ app, sequelize } = startTestApp());
  compliance = (await person(app, ['compliance'], 'rh-compliance')).session;
  const current = (await compliance.get('/api/review-health/settings')).body;
  expect(
    (await compliance.put('/api/review-health/settings', { ...SETTINGS, lockVersion: current.lockVersion })).status,
  ).toBe(200);
  scenario = await healthScenario(app);
  period = { from: daysAgo(90), to: today() };
  const res = await compliance.get(`/api/review-health?${query()}`);
  expect(res.status).toBe(200);
  report = res.body;
});
afterAll(() => sequelize.close());

describe('review-health signals on constructed data', () => {
  it('when a check was signed 10 s after submission, then it alone is listed with its size', () => {
    expect(rowsOf('quick-check').map((r) => r.calcId)).toEqual([scenario.calcs.a1]);
    expect(rowsOf('quick-check')[0].fact).toMatch(
      /^Checked in 10 seconds: \d+ checklist rows, 5 segments, \d+ features?$/,
    );
    expect(rowsOf('quick-check')[0].evidence[0].query).toEqual({
      calcId: String(scenario.calcs.a1),
      action: 'revision.signed',
    });
  });

  it('when checker 1 signed two checks without a finding, then checker 1 is listed and checker 2 is not', () => {
    expect(rowsOf('no-findings').map((r) => r.people)).toEqual([`checker ${scenario.checker1.displayName}`]);
    expect(rowsOf('no-findings')[0].fact).toBe(
      `No findings raised in 2 checks signed from ${period.from} to ${period.to}`,
    );
    expect(report.checkerRates).toEqual(
      expect.arrayContaining([
        { checkerName: scenario.checker1.displayName, authorName: null, checks: 2, checksWithFindings: 0, findings: 0 },
        { checkerName: scenario.checker2.displayName, authorName: null, checks: 1, checksWithFindings: 1, findings: 1 },
      ]),
    );
    expect(report.pairRates).toContainEqual({
      checkerName: scenario.checker2.displayName,
      authorName: scenario.authorB.displayName,
      checks: 1,
      checksWithFindings: 1,
      findings: 1,
    });
  });

  it('when few pairs signed checks, then every pair is listed and the total counts them', () => {
    expect(report.pairRatesTotal).toBeGreaterThan(0);
    expect(report.pairRates).toHaveLength(report.pairRatesTotal);
  });

  it('when every check of author A was by checker 1, then the pairing is listed; author B with one check is not', () => {
    expect(rowsOf('pairing')).toEqual([
      expect.objectContaining({
        measure: 100,
        people: `author ${scenario.authorA.displayName}; checker ${scenario.checker1.displayName}`,
      }),
    ]);
  });

  it('when the approver was refused three times, then it is marked repeated; checker 2’s one refusal is not', () => {
    const rows = rowsOf('refusals');
    expect(rows.map((r) => [r.people, r.measure])).toEqual([
      [scenario.approver.displayName, 3],
      [scenario.checker2.displayName, 1],
    ]);
    expect(rows[0].fact).toMatch(/^Repeated: 3 signing attempts refused \(wrong password ×3\) (between|at) /);
    expect(rows[1].fact).toMatch(/^1 signing attempt refused \(wrong password ×1\) at /);
  });

  it('when a file was added between check and approval, then that approval is listed naming the file', () => {
    expect(rowsOf('attachments-after-check').map((r) => [r.calcId, r.fact])).toEqual([
      [scenario.calcs.a1, expect.stringContaining('added after the check: late-note.pdf')],
    ]);
  });

  it('when v2 took effect 2 days after one approval and 45 and 60 days after the others, then only the first is listed', () => {
    expect(rowsOf('replaced-standard').map((r) => r.calcId)).toEqual([scenario.calcs.a1]);
    expect(rowsOf('replaced-standard')[0].fact).toContain(
      `${scenario.standard.code} v1 2 days before v2 took effect (${scenario.standard.v2On})`,
    );
  });

  it('when v2 fails the shaft, then every approval under v1 is listed as compliant then, not compliant now', () => {
    expect(
      rowsOf('verdict-flip')
        .map((r) => r.calcId)
        .sort(),
    ).toEqual(Object.values(scenario.calcs).sort());
    expect(rowsOf('verdict-flip')[0].fact).toMatch(
      /^Approved as compliant under .* v1; not-compliant when re-evaluated under v2, in force today$/,
    );
  });

  it('when the evidence link of a refusal is followed, then the audit list shows exactly those refused attempts', async () => {
    const link = rowsOf('refusals')[0].evidence[0].query;
    const res = await compliance.get(`/api/audit?${new URLSearchParams(link)}`);
    expect(res.body.items.map((e: { action: string }) => e.action)).toEqual(
      Array(3).fill('revision.signature_refused'),
    );
  });

  it('when exported as CSV, then each signal row and rate is a line with its audit links and the caution closes it', async () => {
    const res = await compliance.get(`/api/review-health/signals.csv?${query()}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.text.split('\r\n')[0]).toBe(
      '"signal","fact","project","calc","revision","people","observed at (UTC, ISO 8601)","measure (minutes, checks, %, attempts or days, per signal)","audit trail entries"',
    );
    expect(res.text).toContain('"Short checks for the size of the calc","Checked in 10 seconds');
    expect(res.text).toMatch(
      /Refused attempts: http[^"]*\/audit\?calcId=\d+&userId=\d+&action=revision\.signature_refused/,
    );
    expect(res.text).toContain('"Finding rate per author and checker"');
    const pairLines = res.text.split('\r\n').filter((l) => l.startsWith('"Finding rate per author and checker"'));
    expect(pairLines).toHaveLength(report.pairRatesTotal);
    expect(res.text.trim().split('\r\n').at(-1)).toMatch(/judge no person.*licensed practice govern/);
  });
});

describe.each<[Role, number]>([
  ['author', 403],
  ['checker', 403],
  ['approver', 403],
  ['compliance', 200],
  ['admin', 200],
])('as %s', (role, status) => {
  it(`when reading signals and settings, then ${status}`, async () => {
    const { session } = await signedInAs(app, [role]);
    expect((await session.get(`/api/review-health?${query()}`)).status).toBe(status);
    expect((await session.get('/api/review-health/settings')).status).toBe(status);
  });
});

describe('bad input', () => {
  it('when signed out, then 401', async () => {
    expect((await request(app).get(`/api/review-health?${query()}`)).status).toBe(401);
  });

  it.each([
    ['from=2026-13-01&to=2026-12-01', 'query.from', 'must be a date'],
    ['from=2026-12-02&to=2026-12-01', 'query.from', 'must not be after To'],
    ['to=2026-12-01', 'query.from', 'must be a date'],
    ['from=2000-01-01&to=2026-12-01', 'query.to', 'the period may span at most'],
    ['from=2026-11-01&to=2026-12-01&projectId=0x10', 'query.projectId', 'must be a project'],
  ])('when the query is %s, then 400 naming %s', async (q, field, message) => {
    const res = await compliance.get(`/api/review-health?${q}`);
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors[field][0]).toContain(message);
  });

  it("when From is not a date, then the message names the field once, in the screen's word", async () => {
    const res = await compliance.get(`/api/review-health?from=2026-13-01&to=2026-12-01`);
    expect(res.body.message).toBe('Invalid input — From: must be a date (YYYY-MM-DD)');
  });

  it('when the project does not exist, then 404', async () => {
    expect(
      (await compliance.get(`/api/review-health?projectId=999999999&from=${daysAgo(9)}&to=${today()}`)).status,
    ).toBe(404);
  });
});

// Last: the report above was read with SETTINGS; this changes them and puts them back.
describe('changing the thresholds', () => {
  it('when admin changes them, then they are stored with one audit entry naming each change, and a stale copy gets 409', async () => {
    const admin = await person(app, ['admin'], 'rh-admin');
    const before = (await admin.session.get('/api/review-health/settings')).body;
    const res = await admin.session.put('/api/review-health/settings', {
      ...SETTINGS,
      silentCheckerChecks: 12,
      lockVersion: before.lockVersion,
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      ...SETTINGS,
      silentCheckerChecks: 12,
      lockVersion: before.lockVersion + 1,
      updatedBy: admin.displayName,
    });
    const entry = await AuditEvent.findOne({
      where: { action: 'review_health.settings_changed', actorId: admin.user.id },
    });
    expect(JSON.parse(entry!.payload)).toEqual({ changed: { silentCheckerChecks: { before: 2, after: 12 } } });
    const stale = await admin.session.put('/api/review-health/settings', {
      ...SETTINGS,
      lockVersion: before.lockVersion,
    });
    expect(stale.status).toBe(409);
    expect(
      (await admin.session.put('/api/review-health/settings', { ...SETTINGS, lockVersion: before.lockVersion + 1 }))
        .status,
    ).toBe(200);
  });
});
