// The screens the screen benchmark visits: who signs in, which address, and what "usable" means on each.
import type { Page } from 'playwright-core';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { Calc, Project } from '../server/db/models';

/*
 * "Usable" is measured, per screen, as: its main content and (where it has one) the verdict are on screen, and it
 * accepts input (the editor's fields are there, enabled when the reader may edit; the calc page's next step is
 * there). Each `ready` waits for all of those, not for the first sign of life.
 */
export interface Screen {
  name: string;
  user: string;
  url: string;
  ready: (page: Page) => Promise<unknown>;
}

const all = (...waits: Promise<unknown>[]) => Promise.all(waits);

export async function screens(): Promise<Screen[]> {
  const sequelize = createSequelize(loadConfig());
  const calc = await Calc.findOne({ where: { number: 'CV1200-SH-001' } });
  const project = await Project.findOne({ where: { code: 'KFD-CV1200' } });
  await sequelize.close();
  if (!calc || !project) throw new Error('the demo data is not loaded (npm run seed)');
  const latest = await calcLatest(calc.id);
  return [
    {
      name: 'overview',
      user: 'checker',
      url: '/',
      ready: (p) =>
        all(
          p.getByRole('heading', { name: /Good to see you/ }).waitFor(),
          p.locator('section.waiting h3.queue-title').first().waitFor(),
        ),
    },
    {
      name: 'projects',
      user: 'author',
      url: '/projects',
      ready: (p) =>
        p
          .getByRole('link', { name: /KFD-CV1200/ })
          .first()
          .waitFor(),
    },
    {
      name: 'project calcs',
      user: 'author',
      url: `/projects/${project.id}`,
      ready: (p) => p.getByText('CV1200-SH-001').first().waitFor(),
    },
    {
      name: 'calc page',
      user: 'checker',
      url: `/calcs/${calc.id}`,
      ready: (p) =>
        all(
          p.locator('section.main .status tt-verdict-badge').waitFor(),
          p.locator('tt-checklist-table tr[mat-row]').first().waitFor(),
          p.locator('section.main .status p.next').waitFor(),
        ),
    },
    {
      name: 'editor',
      user: 'author',
      url: `/revisions/${latest}/edit`,
      ready: (p) =>
        all(
          p.locator('tt-verdict-strip [data-verdict]').waitFor(),
          p.locator('[data-path="segments[0].od"]').waitFor(),
        ),
    },
    {
      name: 'audit trail',
      user: 'compliance',
      url: '/audit',
      ready: (p) => p.locator('table tbody tr').first().waitFor(),
    },
    {
      name: 'standards',
      user: 'compliance',
      url: '/rule-sets',
      ready: (p) =>
        p
          .getByText(/KFD-ENG-014/)
          .first()
          .waitFor(),
    },
  ];
}

async function calcLatest(calcId: number): Promise<number> {
  const sequelize = createSequelize(loadConfig());
  const [rows] = await sequelize.query('SELECT MAX(id) AS id FROM revisions WHERE calc_id = ?', {
    replacements: [calcId],
  });
  await sequelize.close();
  return Number((rows as { id: number }[])[0].id);
}
