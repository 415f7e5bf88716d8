import type { Sequelize } from 'sequelize';
import { startTestApp } from '../support/api-harness';
import { daysAgo, healthScenario, today } from '../support/health-harness';
import { pairCounts } from '../../server/review-health/check-signals';
import { scopeOf } from '../../server/review-health/health-scope';

// The pair counts read the period index or the pair-led one, by the period's length (check-signals.ts): only the
// work may differ, never the counts or their order (the screen's ties are settled by that order).
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

let projectId: number;

beforeAll(async () => {
  projectId = (await healthScenario(app)).project.id;
});

describe('pair counts by either index', () => {
  it.each([
    ['every project', () => scopeOf(null, undefined, daysAgo(90), today())],
    ['one project', () => scopeOf(null, projectId, daysAgo(90), today())],
    ['one project, the last two days', () => scopeOf(null, projectId, daysAgo(1), today())],
  ])(
    'when the pairs of %s are counted by the period index and by pair, then the counts are the same',
    async (_n, scope) => {
      // Act
      const byPeriod = await pairCounts(sequelize as Sequelize, scope(), 'revisions_checked_cover');
      const byPair = await pairCounts(sequelize as Sequelize, scope(), 'revisions_pair_checks');

      // Assert
      expect(byPair).toEqual(byPeriod);
    },
  );

  it('when one project’s ninety days are counted, then its three checks are there', async () => {
    const counts = await pairCounts(sequelize as Sequelize, scopeOf(null, projectId, daysAgo(90), today()));
    expect(counts.reduce((n, p) => n + p.checks, 0)).toBe(3);
  });
});
