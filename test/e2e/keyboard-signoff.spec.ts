import type { Express } from 'express';
import type { Locator, Page } from 'playwright-core';
import { startBrowserSession, accessibilityViolations, openSignedOut, pageSettled } from '../support/browser';
import { TEST_PASSWORD } from '../support/api-harness';
import { calcTeam, revisionOf } from '../support/calc-harness';
import { attachRequiredFiles } from '../support/attachment-harness';

// The whole sign-off without a mouse: every step is reached with Tab (focus visible on arrival) and
// done with Enter, Space or typing; axe-core runs on each screen on the way.
let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  session = await startBrowserSession();
});
afterAll(async () => {
  await session?.close();
});

const server = () => session.baseUrl as unknown as Express;
const MAX_TABS = 250;

/** Presses Tab until the target has focus (never clicks); fails if it cannot be reached or its focus is not visible. */
async function tabTo(page: Page, target: Locator, what: string): Promise<void> {
  await target.first().waitFor();
  for (let i = 0; i < MAX_TABS; i++) {
    await page.keyboard.press('Tab');
    const focus = await target.first().evaluate((el) => ({
      isFocused: el === document.activeElement || el.contains(document.activeElement),
      isVisible: (document.activeElement as HTMLElement | null)?.matches(':focus-visible') ?? false,
    }));
    if (focus.isFocused) {
      expect([what, focus.isVisible]).toEqual([what, true]);
      return;
    }
  }
  throw new Error(`${what} cannot be reached with Tab`);
}

async function signInByKeyboard(page: Page, username: string): Promise<string[]> {
  await openSignedOut(session.context, page);
  await tabTo(page, page.getByLabel('Username'), 'Username');
  await page.keyboard.type(username);
  await tabTo(page, page.getByLabel('Password', { exact: true }), 'Password');
  await page.keyboard.type(TEST_PASSWORD);
  const violations = await accessibilityViolations(page);
  await page.keyboard.press('Enter');
  await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
  await pageSettled(page);
  return [...violations, ...(await accessibilityViolations(page))].map((v) => `sign-in/overview: ${v}`);
}

/** Opens the signing dialog from its button, types the password and signs, all from the keyboard. */
async function signByKeyboard(page: Page, button: RegExp, screen: string): Promise<string[]> {
  await tabTo(page, page.getByRole('button', { name: button }), String(button));
  await page.keyboard.press('Enter');
  const dialog = page.getByRole('dialog');
  await tabTo(page, dialog.getByLabel('Your password'), 'Your password');
  await page.keyboard.type(TEST_PASSWORD);
  const violations = (await accessibilityViolations(page)).map((v) => `${screen} dialog: ${v}`);
  await tabTo(page, dialog.getByRole('button', { name: 'Sign', exact: true }), 'Sign');
  await page.keyboard.press('Enter');
  await dialog.waitFor({ state: 'detached' });
  return violations;
}

describe('the sign-off by keyboard alone', () => {
  it('when author, checker and approver use only the keyboard, then the calc is approved and axe finds nothing serious on any screen', async () => {
    const team = await calcTeam(server());
    const first = await revisionOf(team.author.session, team.revisionId);
    await attachRequiredFiles(team.revisionId, first.checklist?.manual ?? []);
    const page = await session.context.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    const problems: string[] = [];
    const calcUrl = `/calcs/${team.calc.id}`;

    problems.push(...(await signInByKeyboard(page, team.author.user.username)));
    await page.goto(calcUrl);
    problems.push(...(await calcPageViolations(page, /Sign and submit for check/, 'author')));
    problems.push(...(await signByKeyboard(page, /Sign and submit for check/, 'submit')));
    await page.getByText('In check').first().waitFor();

    problems.push(...(await signInByKeyboard(page, team.checker.user.username)));
    await page.goto(calcUrl);
    for (const item of first.checklist?.manual ?? []) {
      const box = page.getByRole('checkbox', {
        name: new RegExp(item.text.slice(0, 20).replace(/[.*+?^${}()|[\]\\]/g, '\\$&')),
      });
      await tabTo(page, box, item.text);
      await page.keyboard.press('Space');
      await expectStored(page, box);
    }
    problems.push(...(await calcPageViolations(page, /Sign as checked/, 'checker')));
    problems.push(...(await signByKeyboard(page, /Sign as checked/, 'check')));
    await page.getByText('Waiting for approval by someone other than its checker.').waitFor();

    problems.push(...(await signInByKeyboard(page, team.approver.user.username)));
    await page.goto(calcUrl);
    problems.push(...(await calcPageViolations(page, /^Approve$/, 'approver')));
    problems.push(...(await signByKeyboard(page, /^Approve$/, 'approve')));
    await page.getByText('Released.').waitFor();
    await session.screenshot(page, 'keyboard-approved');

    expect(problems).toEqual([]);
    expect((await revisionOf(team.approver.session, team.revisionId)).status).toBe('approved');
  });
});

/**
 * The server's answer, not the key: the box ticks itself at once, before the tick is stored; the stored tick names
 * who ticked it. The next box can be ticked only after that answer (one tick at a time).
 */
async function expectStored(page: Page, box: Locator): Promise<void> {
  await page
    .getByRole('listitem')
    .filter({ has: box.first() })
    .getByText(/^ticked by /)
    .waitFor();
}

/** axe on the calc page once it is drawn for this person (their signing button is there) and done loading. */
async function calcPageViolations(page: Page, button: RegExp, who: string): Promise<string[]> {
  await page.getByRole('button', { name: button }).waitFor();
  await pageSettled(page);
  return (await accessibilityViolations(page)).map((v) => `calc (${who}): ${v}`);
}
