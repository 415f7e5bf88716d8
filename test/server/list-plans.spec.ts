import type { Sequelize } from 'sequelize';
import { signedInAs, startTestApp } from '../support/api-harness';
import { capturedSelects, fullScans } from '../support/explain-harness';
import { seedPlanRows } from '../support/plan-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

type Session = Awaited<ReturnType<typeof signedInAs>>['session'];
let seeded: Awaited<ReturnType<typeof seedPlanRows>>;
let reader: Session;

beforeAll(async () => {
  seeded = await seedPlanRows(sequelize as Sequelize);
  reader = (await signedInAs(app, ['author', 'checker', 'approver', 'compliance'], 'plan-reader')).session;
});

async function nextCursor(url: string): Promise<string> {
  const res = await reader.get(url);
  expect(res.status).toBe(200);
  return res.body.next;
}

const day = (offset: number) => new Date(Date.now() - offset * 86_400_000).toISOString().slice(0, 10);
const TEN_YEARS = `from=${day(3650)}&to=${day(0)}`;
const cursor = (values: unknown[]) => Buffer.from(JSON.stringify(values)).toString('base64url');
const LATE = new Date().toISOString();
/** Each signal list paged in SQL, with a cursor as its previous page would give it. */
const HEALTH_PAGES: [string, unknown[]][] = [
  ['quick-check', [30, 1]],
  ['refusals', [2, LATE, 1, '1']],
  ['attachments-after-check', [LATE, 1_000_000]],
  ['replaced-standard', [LATE, 1_000_000]],
  ['verdict-flip', [LATE, 1_000_000]],
];

const LISTS: [string, () => Promise<string>][] = [
  ['calc list of a project, newest first', async () => `/api/calcs?projectId=${seeded.projectId}&size=50`],
  [
    'calc list of a project in one state, by number',
    async () => `/api/calcs?projectId=${seeded.projectId}&status=draft&sort=number&dir=asc&size=50`,
  ],
  ['calc list of the library, by title', async () => '/api/calcs?sort=title&dir=desc&size=50'],
  ['calc list of the library in one state, by title', async () => '/api/calcs?status=approved&sort=title&size=50'],
  ['calc list of the library, by state', async () => '/api/calcs?sort=status&size=50'],
  [
    'calc list, second page by keyset',
    async () =>
      `/api/calcs?projectId=${seeded.projectId}&size=50&after=${await nextCursor(`/api/calcs?projectId=${seeded.projectId}&size=50`)}`,
  ],
  ['search box by words', async () => '/api/calcs?q=plan%20shaft&size=50'],
  ['search box by a short number', async () => '/api/calcs?q=P-&size=50'],
  [
    'search box within a project and state, by number',
    async () => `/api/calcs?projectId=${seeded.projectId}&status=draft&q=plan%20sh&sort=number&dir=asc&size=50`,
  ],
  ['search box by state, by title', async () => '/api/calcs?q=shaft&status=approved&sort=title&size=50'],
  ['search box, ordered by state', async () => '/api/calcs?q=plan&sort=status&size=50'],
  ['queues', async () => '/api/dashboard/queues'],
  ['one queue, second page', async () => '/api/dashboard/queues/awaiting-my-check?size=5'],
  ['projects', async () => '/api/projects?size=50'],
  ['standards library', async () => '/api/rule-sets'],
  ['audit list, newest', async () => '/api/audit?size=50'],
  ['audit list of a project', async () => `/api/audit?projectId=${seeded.projectId}&size=50`],
  ['audit list of a calc', async () => `/api/audit?calcId=${seeded.calcId}&size=50`],
  ['audit list of a person', async () => `/api/audit?userId=${seeded.authorId}&size=50`],
  ['audit list by action', async () => '/api/audit?action=revision.signed&size=50'],
  [
    'audit list of a project by action',
    async () => `/api/audit?projectId=${seeded.projectId}&action=revision.signed&size=50`,
  ],
  ['audit list of a person by action', async () => `/api/audit?userId=${seeded.authorId}&action=revision.&size=50`],
  ['audit list by action, third page', async () => '/api/audit?action=revision.&size=50&page=2'],
  [
    'audit list, second page by keyset',
    async () =>
      `/api/audit?projectId=${seeded.projectId}&size=50&after=${await nextCursor(`/api/audit?projectId=${seeded.projectId}&size=50`)}`,
  ],
  ['a calc with its revision history', async () => `/api/calcs/${seeded.calcId}`],
  ['review-health report, all projects over ten years', async () => `/api/review-health?${TEN_YEARS}`],
  ['review-health report, one project', async () => `/api/review-health?projectId=${seeded.projectId}&${TEN_YEARS}`],
  ...HEALTH_PAGES.map(([key, after]): [string, () => Promise<string>] => [
    `review-health ${key} list, a later page by keyset`,
    async () => `/api/review-health/signals/${key}?${TEN_YEARS}&size=25&after=${cursor(after)}`,
  ]),
];

describe('every list query is served by an index', () => {
  it.each(LISTS)(
    'when the %s is read, then no query scans or sorts revisions, calcs or audit entries end to end',
    async (_name, urlOf) => {
      // Arrange
      const url = await urlOf();

      // Act
      const selects = await capturedSelects(sequelize as Sequelize, async () =>
        expect((await reader.get(url)).status).toBe(200),
      );

      // Assert
      expect(selects.length).toBeGreaterThan(0);
      const scans = [];
      for (const sql of selects)
        for (const row of await fullScans(sequelize as Sequelize, sql)) scans.push({ sql: sql.slice(0, 300), row });
      expect(scans).toEqual([]);
    },
  );
});

describe('list pages read summaries, not contents', () => {
  it('when a calc list or the library is read, then no query reads the input, result or checklist texts', async () => {
    const selects = await capturedSelects(sequelize as Sequelize, async () => {
      await reader.get(`/api/calcs?projectId=${seeded.projectId}&size=50`);
      await reader.get(`/api/calcs/${seeded.calcId}`);
      await reader.get('/api/dashboard/queues');
    });
    expect(selects.filter((s) => /`?(input|result|checklist)`?\s*(,|FROM)/i.test(s) && /revisions/i.test(s))).toEqual(
      [],
    );
  });
});
