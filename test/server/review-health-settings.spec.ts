import type { Sequelize } from 'sequelize';
import type { Express } from 'express';
import { startTestApp, person } from '../support/api-harness';
import { AuditEvent } from '../../server/db/models';

let app: Express;
let sequelize: Sequelize;
beforeAll(() => {
  ({ app, sequelize } = startTestApp());
});
afterAll(() => sequelize.close());

const VALID = {
  quickCheckSecondsPerItem: 15,
  silentCheckerChecks: 12,
  pairingSharePercent: 80,
  pairingMinChecks: 6,
  refusalRepeatCount: 4,
  replacedWithinDays: 21,
};

// Only refused changes here: review-health.spec.ts owns the stored values (its report depends on them) and changes them
// while this file runs, so "nothing changes" is read as this person's doing: no change recorded in their name, and the
// refused value not stored. The settings' version would move with the other file's changes.
const changesBy = (userId: number) =>
  AuditEvent.count({ where: { action: 'review_health.settings_changed', actorId: userId } });

describe('review-health thresholds, refused', () => {
  it.each([
    [
      'quickCheckSecondsPerItem',
      0,
      'Seconds of checking per row, segment or feature: must be a whole number from 1 to 3,600',
    ],
    ['silentCheckerChecks', 2.5, 'Checks without a finding before a checker is listed: must be a whole number'],
    [
      'pairingSharePercent',
      101,
      'Share of one author’s checks done by one checker (%): must be a whole number from 50 to 100',
    ],
    ['refusalRepeatCount', '3', 'Refused attempts that count as repeated: must be a whole number'],
    ['replacedWithinDays', null, 'Days before a standard version was replaced: must be a whole number'],
  ])('when %s is %p, then 400 naming that field and nothing changes', async (field, value, message) => {
    const compliance = await person(app, ['compliance'], 'rh-comp');
    const before = (await compliance.session.get('/api/review-health/settings')).body;
    const res = await compliance.session.put('/api/review-health/settings', {
      ...VALID,
      [field]: value,
      lockVersion: before.lockVersion,
    });
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors[field]).toEqual([
      message.includes('from') ? message : expect.stringContaining(message),
    ]);
    expect(await changesBy(compliance.user.id)).toBe(0);
    expect((await compliance.session.get('/api/review-health/settings')).body[field]).not.toEqual(value);
  });

  it('when an unknown field is sent, then 400 naming it', async () => {
    const compliance = await person(app, ['compliance'], 'rh-comp');
    const before = (await compliance.session.get('/api/review-health/settings')).body;
    const res = await compliance.session.put('/api/review-health/settings', {
      ...VALID,
      lockVersion: before.lockVersion,
      quickCheck: 3,
    });
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors.quickCheck).toEqual(['is not an accepted field']);
  });

  it.each(['author', 'checker', 'approver'] as const)('when a %s tries to change them, then 403', async (role) => {
    const p = await person(app, [role]);
    expect((await p.session.put('/api/review-health/settings', { ...VALID, lockVersion: 0 })).status).toBe(403);
  });
});
