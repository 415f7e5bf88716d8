import type { Page } from 'playwright-core';
import { pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { calcTeam } from '../support/calc-harness';

// The material's origins arrive a moment after a pick (with the editor's value). The panels below must not move
// when they do: a shifting page puts a click on another element than the one under the pointer when it started.
const suite = browserSuite();

async function chooseMaterial(page: Page, name: string) {
  await page.getByRole('combobox', { name: 'From the material library' }).click();
  await page.getByRole('option', { name, exact: true }).click();
  await page.getByRole('listbox').waitFor({ state: 'detached' });
}

/** Where the segments table starts on the page (not in the window, which may have scrolled). */
const segmentsTop = (page: Page) =>
  page.locator('tt-segments-table').evaluate((el) => el.getBoundingClientRect().top + window.scrollY);

describe('the material panel in the editor', () => {
  it('when a library material is picked, then its origins appear without moving the panels below', async () => {
    const { author, revisionId } = await calcTeam(suite.server());
    const page = await suite.signedInPage(author.user.username);
    for (const width of [1440, 768, 390]) {
      await page.setViewportSize({ width, height: 900 });
      await page.goto(`/revisions/${revisionId}/edit`);
      await page.locator('tt-verdict-strip [data-verdict]').waitFor();
      await pageSettled(page);
      await chooseMaterial(page, 'Entered by hand');
      await page.locator('tt-material-panel table.provenance').waitFor({ state: 'detached' });
      // Measured once the page has answered the first pick too (its live results and panels redrawn, fonts in).
      await pageSettled(page);
      const before = await segmentsTop(page);
      await screenshotAsSeen(page.locator('tt-material-panel'), `material-origins-by-hand-${width}`);

      await chooseMaterial(page, 'AISI 1045 CD');
      await page.locator('tt-material-panel table.provenance').waitFor();
      await pageSettled(page);

      expect({ width, top: await segmentsTop(page) }).toEqual({ width, top: before });
      await screenshotAsSeen(page.locator('tt-material-panel'), `material-origins-library-${width}`);
      await suite.session.screenshot(page, `material-origins-editor-${width}`);
    }
    await page.close();
  });
});
