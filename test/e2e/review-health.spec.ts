import type { Page } from 'playwright-core';
import { accessibilityViolations, pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { createTestUser } from '../support/api-harness';
import { healthScenario } from '../support/health-harness';

// The review-health screen at 1440, 768 and 390 px over constructed signals: screenshots to look at
// (artifacts/screenshots/review-health-*), no sideways page scroll, axe-core with no serious or critical
// violation, an inline error for a threshold out of range, and a signal's evidence link landing on the audit list.
const suite = browserSuite();
const { signIn } = suite;
let scenario: Awaited<ReturnType<typeof healthScenario>>;
beforeAll(async () => {
  scenario = await healthScenario(suite.server());
});

async function openReport(page: Page) {
  await page.goto('/review-health');
  await page.getByRole('combobox', { name: 'Project' }).click();
  await page.getByRole('option', { name: new RegExp(scenario.project.code) }).click();
  // The option list is an overlay outside the page; measure the page once it has gone.
  await page.getByRole('listbox').waitFor({ state: 'detached' });
  // The report of all projects comes first and reads the same but for its name: wait for this project's.
  await page
    .getByRole('status')
    .filter({ hasText: new RegExp(`${scenario.project.code},[\\s\\S]*checks signed, \\d+ observations`) })
    .waitFor();
  await pageSettled(page);
}

it('when compliance opens review health, then every signal reads as a fact with its limits, at three widths', async () => {
  const page = await suite.session.context.newPage();
  const user = await createTestUser(['compliance'], 'e2e-health');
  await signIn(page, user.username);
  await openReport(page);
  const problems: string[] = [];
  for (const width of [1440, 768, 390]) {
    await page.setViewportSize({ width, height: 900 });
    await page.getByRole('heading', { name: 'Short checks for the size of the calc' }).waitFor();
    await pageSettled(page);
    const { sideways, widest } = await page.evaluate(() => {
      const inScrollBox = (el: Element) => {
        for (let p = el.parentElement; p; p = p.parentElement)
          if (['auto', 'scroll'].includes(getComputedStyle(p).overflowX)) return true;
        return false;
      };
      const wide = Array.from(document.querySelectorAll('body *')).find(
        (el) => el.getBoundingClientRect().right > window.innerWidth + 1 && !inScrollBox(el),
      );
      return {
        sideways: document.documentElement.scrollWidth - window.innerWidth,
        widest: wide ? `${wide.tagName.toLowerCase()}.${Array.from(wide.classList).join('.')}` : '',
      };
    });
    if (sideways > 1) problems.push(`@${width}: page scrolls sideways by ${sideways}px (${widest})`);
    await suite.session.screenshot(page, `review-health-${width}`);
    await screenshotAsSeen(page, `review-health-${width}-top`);
    problems.push(...(await accessibilityViolations(page)).map((v) => `@${width}: ${v}`));
  }
  expect(problems).toEqual([]);
  await expect(page.getByText(/^Repeated: 3 signing attempts refused/).count()).resolves.toBe(1);
  await expect(page.getByText('Limits:').count()).resolves.toBe(7);
  await page.close();
});

it('when a threshold is out of range, then the field says so inline and nothing is sent', async () => {
  const page = await suite.session.context.newPage();
  const user = await createTestUser(['admin'], 'e2e-health-admin');
  await signIn(page, user.username);
  await openReport(page);
  const field = page.getByLabel('Share of one author’s checks done by one checker (%)');
  await field.fill('120');
  await page.getByRole('button', { name: 'Save thresholds' }).click();
  await page
    .getByText('Share of one author’s checks done by one checker (%): enter a whole number from 50 to 100')
    .waitFor();
  await page.setViewportSize({ width: 1440, height: 900 });
  await field.scrollIntoViewIfNeeded();
  await screenshotAsSeen(page, 'review-health-threshold-error');
  await page.close();
});

it('when an evidence link is followed, then the audit list opens filtered to the entries behind the signal', async () => {
  const page = await suite.session.context.newPage();
  const user = await createTestUser(['compliance'], 'e2e-health-link');
  await signIn(page, user.username);
  await openReport(page);
  await page.getByRole('link', { name: 'Refused attempts' }).first().click();
  await page.waitForURL(/\/audit\?.*action=revision\.signature_refused/);
  await page
    .getByRole('cell', { name: /was refused a signature/ })
    .first()
    .waitFor();
  await expect(page.getByRole('cell', { name: /was refused a signature/ }).count()).resolves.toBe(3);
  await screenshotAsSeen(page, 'review-health-audit-link');
  await page.close();
});
