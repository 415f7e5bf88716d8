import type { Page } from 'playwright-core';
import { accessibilityViolations, pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { createTestUser } from '../support/api-harness';
import { advanceTo, calcTeam } from '../support/calc-harness';

// Every screen this work touched, at desk (1440), tablet (768) and phone (390) widths: screenshots to
// look at, no sideways page scroll, the menu out of the way on a phone, and axe-core with no serious
// or critical violation at 1440 and 390.
const suite = browserSuite();
const WIDTHS = [1440, 768, 390] as const;

/** Measures what a person would notice first: the page scrolling sideways, the menu eating the width. */
async function layoutOf(page: Page) {
  return page.evaluate(() => {
    const nav = document.querySelector('nav[aria-label="Main"]') as HTMLElement | null;
    const org = document.querySelector('.org') as HTMLElement | null;
    // The outermost element sticking out on the right, to name in the failure (inside scroll boxes is fine).
    const inScrollBox = (el: Element) => {
      for (let p = el.parentElement; p; p = p.parentElement)
        if (['auto', 'scroll'].includes(getComputedStyle(p).overflowX)) return true;
      return false;
    };
    const wide = Array.from(document.querySelectorAll('main *')).find(
      (el) => el.getBoundingClientRect().right > window.innerWidth + 1 && !inScrollBox(el),
    );
    return {
      widest: wide ? `${wide.tagName.toLowerCase()}.${Array.from(wide.classList).join('.')}` : '',
      sideways: document.documentElement.scrollWidth - window.innerWidth,
      navShare:
        nav && nav.offsetParent !== null
          ? Math.round((nav.getBoundingClientRect().width / window.innerWidth) * 100)
          : 0,
      orgShown: !!org && org.offsetParent !== null,
    };
  });
}

async function visit(page: Page, name: string, ready: () => Promise<unknown>) {
  const problems: string[] = [];
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: 900 });
    await ready();
    // The whole screen, not the moment its heading came: lists loaded, the editor's later panels built, fonts in.
    await pageSettled(page);
    const layout = await layoutOf(page);
    if (layout.sideways > 1)
      problems.push(`${name}@${width}: page scrolls sideways by ${layout.sideways}px (${layout.widest})`);
    if (width === 390 && (layout.navShare > 0 || layout.orgShown))
      problems.push(`${name}@390: menu takes ${layout.navShare}% / organisation shown`);
    if (width === 768 && layout.navShare > 15) problems.push(`${name}@768: menu takes ${layout.navShare}%`);
    await suite.session.screenshot(page, `screens-${name}-${width}`);
    // What a person sees first, without scrolling.
    await screenshotAsSeen(page, `screens-${name}-${width}-top`);
    if (width !== 768) problems.push(...(await accessibilityViolations(page)).map((v) => `${name}@${width}: ${v}`));
  }
  return problems;
}

describe('screens at desk, tablet and phone widths', () => {
  it('when each screen is opened at 1440, 768 and 390 px, then nothing scrolls sideways, the menu gives way and axe finds nothing serious', async () => {
    const checkerTeam = await calcTeam(suite.server());
    await advanceTo(
      'in_check',
      {
        author: checkerTeam.author.session,
        checker: checkerTeam.checker.session,
        approver: checkerTeam.approver.session,
      },
      checkerTeam.revisionId,
    );
    const draft = await calcTeam(suite.server());
    const compliance = await createTestUser(['compliance', 'admin'], 'e2e-screens-compliance');
    const problems: string[] = [];
    const page = await suite.session.context.newPage();

    await suite.signIn(page, draft.author.user.username);
    problems.push(
      ...(await visit(page, 'overview', () => page.getByRole('heading', { name: /Good to see you/ }).waitFor())),
    );
    await page.goto(`/revisions/${draft.revisionId}/edit`);
    problems.push(
      ...(await visit(page, 'editor', () =>
        page
          .getByText(/Meets|Does not meet/)
          .first()
          .waitFor(),
      )),
    );
    await page.goto(`/projects/${draft.project.id}`);
    problems.push(...(await visit(page, 'project-calcs', () => page.locator('mat-paginator').waitFor())));
    await page.goto(`/calcs/${draft.calc.id}`);
    problems.push(
      ...(await visit(page, 'calc-draft', () => page.getByRole('button', { name: /Sign and submit/ }).waitFor())),
    );

    await suite.signIn(page, checkerTeam.checker.user.username);
    await page.goto(`/calcs/${checkerTeam.calc.id}`);
    problems.push(...(await visit(page, 'calc-checker', () => page.getByRole('checkbox').first().waitFor())));
    await page.getByRole('tab', { name: /Findings/ }).click();
    problems.push(...(await visit(page, 'findings', () => page.getByLabel('New finding').waitFor())));
    await page.getByRole('button', { name: /Sign as checked/ }).click();
    problems.push(
      ...(await visit(page, 'sign-dialog', () =>
        page
          .getByRole('dialog')
          .getByText(/cannot be signed as checked yet/)
          .waitFor(),
      )),
    );
    await page.keyboard.press('Escape');

    await suite.signIn(page, compliance.username);
    await page.goto('/audit');
    problems.push(
      ...(await visit(page, 'audit', () => page.getByRole('heading', { name: /Audit/ }).first().waitFor())),
    );
    await page.goto('/rule-sets');
    problems.push(...(await visit(page, 'rule-sets', () => page.getByRole('heading').first().waitFor())));
    // Two versions of one standard side by side: its tables held the widest text of any screen.
    const versions = await page.evaluate(async () => await (await fetch('/api/rule-sets')).json());
    const [older, newer] = (versions as { id: number; code: string; version: number }[])
      .filter((v) => v.code === 'KFD-ENG-014')
      .sort((a, b) => a.version - b.version);
    await page.goto(`/rule-sets/compare?from=${older.id}&to=${newer.id}`);
    problems.push(
      ...(await visit(page, 'compare', () => page.getByRole('heading', { name: 'Parameters', exact: true }).waitFor())),
    );
    await page.goto('/projects');
    problems.push(...(await visit(page, 'projects', () => page.locator('mat-paginator').waitFor())));
    await page.goto('/admin/users');
    problems.push(...(await visit(page, 'people', () => page.locator('mat-paginator').waitFor())));
    await page.goto('/admin/sent-mail');
    problems.push(...(await visit(page, 'sent-mail', () => page.locator('mat-paginator').waitFor())));
    await page.goto('/review-health');
    problems.push(
      ...(await visit(page, 'review-health', () =>
        page
          .getByText(/checks signed/)
          .first()
          .waitFor(),
      )),
    );
    await page.goto('/verify');
    problems.push(
      ...(await visit(page, 'verify', () => page.getByRole('heading', { name: 'Verify a record' }).waitFor())),
    );

    // On a phone the menu opens from the top bar and closes once a page is chosen.
    await page.setViewportSize({ width: 390, height: 900 });
    const menu = page.getByRole('button', { name: 'Main menu' });
    await menu.click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link').first().click();
    // The click only asks for the menu to close; the page is drawn again a moment later (with the toggle's state).
    await page.locator('button[aria-label="Main menu"][aria-expanded="false"]').waitFor();
    expect((await layoutOf(page)).navShare).toBe(0);

    expect(problems).toEqual([]);
    expect(suite.session.outsideRequests).toEqual([]);
  });
});
