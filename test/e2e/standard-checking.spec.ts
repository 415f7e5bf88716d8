import { accessibilityViolations, pageSettled, screenshotAsSeen } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { createTestUser } from '../support/api-harness';
import { testStandard } from '../support/standard-harness';

// The standards view's "How calcs are checked" at 1440, 768 and 390 px: screenshots to look at
// (artifacts/screenshots/standard-checking-*), no sideways page scroll, axe-core with no serious or critical violation.
const suite = browserSuite();
const { signIn } = suite;

it('when a reader opens a standard that asks for an independent model, then its methods tab says how calcs are checked, at three widths', async () => {
  const standard = await testStandard((doc) => {
    doc['verification'] = {
      method: 'independent-model',
      scope: { kind: 'torque-at-least', value: 500 },
      tolerances: { inputs: 0.001, results: 0.02 },
      origin: 'house choice, after the design-verification practice of alternate calculations',
    };
  });
  const page = await suite.session.context.newPage();
  const user = await createTestUser(['author'], 'e2e-checking');
  await signIn(page, user.username);
  await page.goto(`/rule-sets/${standard.id}`);
  await page.getByRole('tab', { name: 'Methods and manual items' }).click();
  await page.getByRole('heading', { name: 'How calcs are checked' }).waitFor();
  const problems: string[] = [];
  for (const width of [1440, 768, 390]) {
    await page.setViewportSize({ width, height: 900 });
    await page.getByText('Independent model required for calcs with largest external torque ≥ 500 N·m').waitFor();
    await pageSettled(page);
    const sideways = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    if (sideways > 1) problems.push(`@${width}: page scrolls sideways by ${sideways}px`);
    await page.getByRole('heading', { name: 'How calcs are checked' }).scrollIntoViewIfNeeded();
    await screenshotAsSeen(page, `standard-checking-${width}`);
    problems.push(...(await accessibilityViolations(page)).map((v) => `@${width}: ${v}`));
  }
  expect(problems).toEqual([]);
  await page.close();
});
