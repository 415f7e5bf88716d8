import type { Route } from 'playwright-core';
import { pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { calcTeam } from '../support/calc-harness';
import { pdfBytes } from '../support/upload-harness';

// An attachment changes the revision's signed content, so the calc page reads the revision again. While that read is
// held back here, the workflow actions wait and say why (artifacts/screenshots/calc-updating-*).
const suite = browserSuite({ s3: true });

it('when an attachment is added, then signing waits, visibly, until the fresh revision arrives', async () => {
  const { author, calc } = await calcTeam(suite.server());
  const page = await suite.signedInPage(author.user.username);
  await page.goto(`/calcs/${calc.id}`);
  const submit = page.getByRole('button', { name: 'Sign and submit for check' });
  await submit.waitFor();
  const held: Route[] = [];
  let heldOne = () => {};
  const readHeld = new Promise<void>((resolve) => (heldOne = resolve));
  await page.route(/\/api\/calcs\/\d+\/latest-revision$/, (route) => {
    held.push(route);
    heldOne();
  });
  await page.getByRole('tab', { name: 'Attachments' }).click();
  await page
    .getByLabel('File to attach')
    .setInputFiles({ name: 'DRG-1 sheet 2.pdf', mimeType: 'application/pdf', buffer: pdfBytes(4000) });
  const tabsTop = () => page.locator('mat-tab-group').evaluate((el) => el.getBoundingClientRect().top + window.scrollY);
  // Measured on the finished page (nothing loading, fonts in), not on a moment of its drawing.
  await pageSettled(page);
  const before = await tabsTop();
  await page.getByRole('button', { name: 'Attach', exact: true }).click();
  await page.getByRole('status').filter({ hasText: 'Updating the revision…' }).waitFor();
  // The reason takes the next step's line: the tabs below do not move under the pointer.
  await expect(tabsTop()).resolves.toBe(before);

  await expect(submit.isDisabled()).resolves.toBe(true);
  for (const width of [1440, 768, 390]) {
    await page.setViewportSize({ width, height: 900 });
    await screenshotAsSeen(page, `calc-updating-${width}`);
  }

  // The read may reach the route a moment after the screen says it is updating: release it only once it is held.
  await readHeld;
  for (const route of held) await route.continue();
  await page.unroute(/\/api\/calcs\/\d+\/latest-revision$/);
  await page.getByRole('status').filter({ hasText: 'Updating the revision…' }).waitFor({ state: 'detached' });
  await submit.click({ trial: true }); // waits until the button is enabled again
  await expect(submit.isEnabled()).resolves.toBe(true);
  await page.close();
});
