import { randomUUID } from 'node:crypto';
import type { Page } from 'playwright-core';
import { accessibilityViolations, pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { createTestProject, createTestUser } from '../support/api-harness';

// An office with more projects than one answer lists: the audit trail's project field finds any of them by typing,
// says how many more there are, is used from the keyboard, and reads cleanly to axe (artifacts/screenshots/
// project-picker-*).
const suite = browserSuite();

const picker = (page: Page) => page.getByRole('combobox', { name: 'Project' });
/** The picker's hint under its field (the list itself is in an overlay elsewhere in the page). */
const hint = (page: Page) => page.locator('tt-project-picker mat-hint');
/** The picker's unfiltered list arriving (on opening the page, and again once a search gives way to a choice). */
const fullList = (page: Page) =>
  page.waitForResponse((r) => r.url().includes('/api/projects?') && !new URL(r.url()).searchParams.has('q'));

/** Shots at three widths of the picker with its list closed: its hint must not describe a list not shown. */
async function closedShots(page: Page, name: string): Promise<void> {
  for (const width of [1440, 768, 390]) {
    await page.setViewportSize({ width, height: 900 });
    await pageSettled(page);
    await suite.session.screenshot(page, `${name}-${width}`);
    await expect(hint(page).allInnerTexts()).resolves.toEqual([]);
  }
  await page.setViewportSize({ width: 1440, height: 900 });
}

it('when the office has more projects than one answer lists, then typing finds and chooses any of them', async () => {
  const run = randomUUID().slice(0, 6);
  const projects = [];
  for (let i = 1; i <= 30; i++) projects.push(await createTestProject({ name: `Fen picker ${run} line ${i}` }));
  const last = projects[29];
  const user = await createTestUser(['compliance'], 'e2e-picker');
  const page = await suite.signedInPage(user.username);
  const listed = fullList(page);
  await page.goto('/audit');
  await listed;
  await closedShots(page, 'project-picker-closed');
  const problems: string[] = [];
  for (const width of [1440, 768, 390]) {
    await page.setViewportSize({ width, height: 900 });
    await picker(page).click();
    await page.getByRole('option', { name: /more — type to narrow/ }).waitFor();
    await pageSettled(page);
    await suite.session.screenshot(page, `project-picker-open-${width}`);
    problems.push(...(await accessibilityViolations(page)).map((v) => `@${width}: ${v}`));
    await page.keyboard.press('Escape');
  }
  expect(problems).toEqual([]);

  // From the keyboard: type part of a name, arrow down to the match, Enter.
  await page.setViewportSize({ width: 1440, height: 900 });
  const filtered = page.waitForRequest(
    (r) => r.url().includes(`/api/audit?`) && r.url().includes(`projectId=${last.id}`),
  );
  await picker(page).focus();
  await page.keyboard.type(`${run} line 30`);
  const wanted = `${last.code} · Fen picker ${run} line 30`;
  // The newest project is already in the list before the search answers; arrowing then would be undone when the
  // answer redraws the list. Wait until every project listed is the one typed for: the search has answered.
  await page.waitForFunction((name) => {
    const texts = Array.from(document.querySelectorAll('mat-option'), (o) => o.textContent?.trim() ?? '');
    const listed = texts.filter((t) => t !== 'All projects');
    return listed.length > 0 && listed.every((t) => t === name);
  }, wanted);
  // After each redraw of the list, Material's autocomplete clears the active option from a timer; Chromium may handle
  // key presses before a waiting timer, so on a busy machine arrowing was undone. Let the waiting timers run first.
  await page.evaluate(() => new Promise((resolve) => setTimeout(resolve)));
  const activeText = (selector: string) => document.querySelector(selector)?.textContent?.trim() ?? '';
  const ACTIVE = 'mat-option.mat-mdc-option-active';
  const active = () => page.evaluate(activeText, ACTIVE);
  // A key press moves the active option at once, but the page shows it only after its next change detection: read
  // too early, the old option still looks active and one more press passes the wanted one. Each press changes the
  // active option (the list wraps), so wait for the page to show that change before judging it.
  for (let presses = 0; presses < 4 && (await active()) !== wanted; presses++) {
    const before = await active();
    await page.keyboard.press('ArrowDown');
    await page.waitForFunction(
      ([selector, previous]) => (document.querySelector(selector)?.textContent?.trim() ?? '') !== previous,
      [ACTIVE, before],
    );
  }
  await screenshotAsSeen(page, 'project-picker-keyboard-1440');
  expect(await active()).toBe(wanted);
  const relisted = fullList(page);
  await page.keyboard.press('Enter');
  await Promise.all([filtered, relisted]);
  await expect(picker(page).inputValue()).resolves.toBe(wanted);
  await closedShots(page, 'project-picker-chosen');
  await page.close();
});
