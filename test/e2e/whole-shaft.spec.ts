import { accessibilityViolations, pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { calcTeam } from '../support/calc-harness';
import { wholeShaftInput } from '../support/shaft-fixture';

// The calc editor and calc page of a whole-shaft calc in Chromium, at desktop, tablet and phone
// widths: bearings and forces entered, the outline with arrows, the new diagrams and tables.
const suite = browserSuite();

describe('the whole shaft in the browser', () => {
  it('when the author opens a calc with bearings and forces, then the editor shows them, their arrows and results at every width, without accessibility faults', async () => {
    const { author, revisionId } = await calcTeam(suite.server(), wholeShaftInput());
    const page = await suite.session.context.newPage();
    await suite.signIn(page, author.user.username);
    for (const width of [1440, 768, 390]) {
      await page.setViewportSize({ width, height: 900 });
      await page.goto(`/revisions/${revisionId}/edit`);
      await page.getByRole('table', { name: 'Bearing reactions and life' }).waitFor();
      await page.getByRole('img', { name: /bearings B1 at 20 mm, B2 at 300 mm/ }).waitFor();
      // The result tables come before the input panels below the segments are built; axe reads all of them.
      await pageSettled(page);
      await suite.session.screenshot(page, `whole-shaft-editor-${width}`);
      await screenshotAsSeen(page, `whole-shaft-editor-${width}-top`);
      // The parts to look at closely, one picture each (the full page is too tall to read).
      for (const [part, selector] of [
        ['outline', 'tt-shaft-drawing'],
        ['bearings', 'tt-supports-panel'],
        ['forces', 'tt-forces-panel'],
        ['results', 'tt-shaft-results'],
        ['deflection', 'tt-plots-panel tt-diagram-chart >> nth=2'],
        ['slope', 'tt-plots-panel tt-diagram-chart >> nth=3'],
      ]) {
        await screenshotAsSeen(page.locator(selector), `whole-shaft-${part}-${width}`);
      }
      expect(await accessibilityViolations(page)).toEqual([]);
    }
    // Live: a heavier gear (smaller pitch diameter, same torque) raises the reaction at B1.
    const before = await page
      .getByRole('table', { name: 'Bearing reactions and life' })
      .locator('tbody tr')
      .first()
      .innerText();
    await page.locator('[data-path="loads[0].pitchDiameter"]').fill('120');
    await page
      .getByRole('table', { name: 'Bearing reactions and life' })
      .locator('tbody tr')
      .first()
      .filter({ hasNotText: before.split('\t')[4] ?? '' })
      .waitFor();
    await page.close();
  });

  it("when a reader opens the calc page, then the results tab has the reactions, critical speed and the model's assumptions", async () => {
    const { author, calc } = await calcTeam(suite.server(), wholeShaftInput());
    const page = await suite.session.context.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await suite.signIn(page, author.user.username);
    await page.goto(`/calcs/${calc.id}`);
    await page.getByRole('tab', { name: 'Results' }).click();
    await page.getByRole('table', { name: 'Bearing reactions and life' }).waitFor();
    await page.getByText('What this model assumes').waitFor();
    await pageSettled(page);
    await suite.session.screenshot(page, 'whole-shaft-calc-page');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });
});
