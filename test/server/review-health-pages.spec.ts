import type { Sequelize } from 'sequelize';
import type { Express } from 'express';
import {
  SIGNAL_PAGE,
  type HealthReport,
  type SignalKey,
  type SignalPage,
} from '../../shared/schemas/review-health.schema';
import { startTestApp, person, type Session } from '../support/api-harness';
import { daysAgo, healthScenario, today } from '../support/health-harness';

let app: Express;
let sequelize: Sequelize;
let scenario: Awaited<ReturnType<typeof healthScenario>>;
let compliance: Session;
let report: HealthReport;

// Fixed once the scenario is built, so a run that passes midnight (UTC) reads the report and its pages over one period.
let days: { from: string; to: string };
const period = () => `projectId=${scenario.project.id}&from=${days.from}&to=${days.to}`;
const signalOf = (key: SignalKey) => report.signals.find((s) => s.key === key)!;

/** Every row of one signal, read one page of `size` at a time by following `next`. */
async function allPages(key: SignalKey, size: number): Promise<SignalPage[]> {
  const pages: SignalPage[] = [];
  let after = '';
  do {
    const res = await compliance.get(
      `/api/review-health/signals/${key}?${period()}&size=${size}${after ? `&after=${after}` : ''}`,
    );
    expect(res.status).toBe(200);
    pages.push(res.body);
    after = res.body.next ?? '';
  } while (after && pages.length < 20);
  return pages;
}

const settingsVersion = async (): Promise<number> =>
  (await compliance.get('/api/review-health/settings')).body.lockVersion;

/**
 * The report and one signal's pages read under one version of the thresholds. review-health.spec.ts changes them while
 * this file runs (a signal such as no-findings then lists other rows), so a read that spans a change is read again.
 */
async function pagesBesideReport(key: SignalKey, size: number): Promise<{ pages: SignalPage[]; signal: SignalRows }> {
  for (let attempt = 1; ; attempt++) {
    const version = await settingsVersion();
    const res = await compliance.get(`/api/review-health?${period()}`);
    const pages = await allPages(key, size);
    if ((await settingsVersion()) === version || attempt === 5) {
      return { pages, signal: (res.body as HealthReport).signals.find((s) => s.key === key)! };
    }
  }
}
type SignalRows = HealthReport['signals'][number];

beforeAll(async () => {
  ({ app, sequelize } = startTestApp());
  compliance = (await person(app, ['compliance'], 'rh-pages')).session;
  scenario = await healthScenario(app);
  days = { from: daysAgo(90), to: today() };
  const res = await compliance.get(`/api/review-health?${period()}`);
  expect(res.status).toBe(200);
  report = res.body;
});
afterAll(() => sequelize.close());

describe('each signal list is paged on its own', () => {
  it('when the report is read, then each signal carries its total, its first page and no cursor when that is all', () => {
    for (const s of report.signals) {
      expect(s.rows.length).toBe(Math.min(s.total, SIGNAL_PAGE));
      expect(s.next).toBeNull();
    }
    expect(signalOf('verdict-flip').total).toBe(Object.keys(scenario.calcs).length);
  });

  it.each<SignalKey>(['verdict-flip', 'refusals', 'no-findings'])(
    'when the %s list is read one row at a time, then the pages hold the report’s rows in its order, once each',
    async (key) => {
      const { pages, signal } = await pagesBesideReport(key, 1);
      expect(pages.flatMap((p) => p.rows)).toEqual(signal.rows);
      expect(pages[0].total).toBe(signal.total);
      expect(pages.at(-1)!.next).toBeNull();
    },
  );
});

describe('bad page requests', () => {
  it.each([
    ['quick-check', 'size=0', 'query.size', 'must be a whole number from 1 to 100'],
    ['quick-check', 'size=many', 'query.size', 'must be a whole number from 1 to 100'],
    ['refusals', 'after=bm90LWEtY3Vyc29y', 'after', 'is not a page cursor of this list'],
    ['verdict-flip', `after=${Buffer.from('["yesterday",3]').toString('base64url')}`, 'after', 'is not a page cursor'],
    ['no-findings', `after=${Buffer.from('[-4]').toString('base64url')}`, 'after', 'is not a page cursor'],
    ['everything', '', 'params.key', 'must be one of quick-check'],
  ])('when the %s list is asked with %s, then 400 naming %s', async (key, q, field, message) => {
    const res = await compliance.get(`/api/review-health/signals/${key}?${period()}&${q}`);
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors[field][0]).toContain(message);
  });

  it('when the page size is bad, then the 400 names it as the screen does, never by its code name', async () => {
    const res = await compliance.get(`/api/review-health/signals/quick-check?${period()}&size=500`);
    expect(res.status).toBe(400);
    expect(res.body.message).toBe('Invalid input — Items per page: must be a whole number from 1 to 100');
  });

  it('when the period is wrong, then 400 naming From, as for the report', async () => {
    const res = await compliance.get('/api/review-health/signals/refusals?from=2026-12-02&to=2026-12-01');
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors['query.from'][0]).toBe('must not be after To');
  });

  it('when someone without compliance reads a page, then 403', async () => {
    const author = await person(app, ['author'], 'rh-pages-author');
    expect((await author.session.get(`/api/review-health/signals/refusals?${period()}`)).status).toBe(403);
  });
});
