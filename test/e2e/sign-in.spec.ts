import type { Page } from 'playwright-core';
import { accessibilityViolations, openSignedOut, pageSettled } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { createTestUser, TEST_PASSWORD } from '../support/api-harness';

const suite = browserSuite();

async function signIn(page: Page, username: string, password = TEST_PASSWORD) {
  await openSignedOut(suite.session.context, page, '/');
  await page.getByLabel('Username').fill(username);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

describe('signing in through the real page', () => {
  it('when a visitor opens the app, then the sign-in page shows, passes axe and loads nothing from outside', async () => {
    const page = await suite.session.context.newPage();
    await page.goto('/');
    await page.waitForURL(/\/sign-in/);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await suite.session.screenshot(page, 'sign-in');
    expect(await accessibilityViolations(page)).toEqual([]);
    expect(suite.session.outsideRequests).toEqual([]);
    await page.close();
  });

  it('when the password is wrong, then one generic message shows and no session starts', async () => {
    const user = await createTestUser(['author']);
    const page = await suite.session.context.newPage();
    await signIn(page, user.username, 'not the password at all');
    await page.getByRole('alert').filter({ hasText: 'Username or password is not correct' }).waitFor();
    expect(page.url()).toContain('/sign-in');
    await page.close();
  });

  it.each([
    [['author'], ['Overview', 'Projects'], ['Audit trail', 'People and roles']],
    [['compliance'], ['Overview', 'Projects', 'Audit trail'], ['People and roles']],
    [['admin'], ['Overview', 'Projects', 'Audit trail', 'People and roles'], []],
  ] as const)('when a %j user signs in, then the overview shows their navigation', async (roles, visible, hidden) => {
    const user = await createTestUser([...roles]);
    const page = await suite.session.context.newPage();
    await signIn(page, user.username);
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const label of visible) await nav.getByRole('link', { name: label }).waitFor();
    for (const label of hidden) expect(await nav.getByRole('link', { name: label }).count()).toBe(0);
    await page.getByRole('heading', { name: 'Waiting for you' }).waitFor();
    await pageSettled(page);
    await suite.session.screenshot(page, `dashboard-${roles.join('-')}`);
    expect(await accessibilityViolations(page)).toEqual([]);
    expect(suite.session.outsideRequests).toEqual([]);
    await page.getByRole('button', { name: /account menu/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.close();
  });
});
