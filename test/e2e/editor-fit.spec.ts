import { pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { calcTeam } from '../support/calc-harness';

// Choices in the editor's selects read in full at desktop and tablet widths; the editor and the calc page are
// photographed at every width (look at artifacts/screenshots/editor-fit-*).
const suite = browserSuite();

describe('the editor at desktop and tablet widths', () => {
  it("when the author opens a calc with fatigue, then each fatigue choice's label is shown whole, not cut off", async () => {
    const { author, calc, revisionId } = await calcTeam(suite.server());
    const page = await suite.session.context.newPage();
    await suite.signIn(page, author.user.username);
    for (const width of [1440, 768, 390]) {
      await page.setViewportSize({ width, height: 900 });
      await page.goto(`/revisions/${revisionId}/edit`);
      const edition = page.locator('tt-fatigue-panel mat-form-field', { hasText: 'Table 6-2 edition' });
      await edition.getByText('9th–10th (default)').waitFor();
      await page.locator('tt-verdict-strip [data-verdict]').waitFor();
      // Measured in the page's own font: the fallback one is wider and cuts labels that fit.
      await pageSettled(page);
      await suite.session.screenshot(page, `editor-fit-editor-${width}`);
      await screenshotAsSeen(page.locator('tt-fatigue-panel'), `editor-fit-fatigue-${width}`);
      // The select's value text is clipped with an ellipsis when its box is narrower than the words.
      const cut = await page
        .locator('tt-fatigue-panel .mat-mdc-select-value')
        .evaluateAll((els) => els.filter((e) => e.scrollWidth > e.clientWidth).map((e) => e.textContent?.trim()));
      expect({ width, cut }).toEqual({ width, cut: [] });

      await page.goto(`/calcs/${calc.id}`);
      await page.locator('tt-checklist-table tr[mat-row]').first().waitFor();
      await suite.session.screenshot(page, `editor-fit-calc-page-${width}`);
    }
    await page.close();
  });
});
