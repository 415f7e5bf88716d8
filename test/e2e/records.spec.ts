import type { Express } from 'express';
import type { Page } from 'playwright-core';
import { startBrowserSession, accessibilityViolations } from '../support/browser';
import { TEST_PASSWORD, createTestUser } from '../support/api-harness';
import { advanceTo, calcTeam, revisionOf } from '../support/calc-harness';
import { startTestS3 } from '../support/fake-servers';
import { pdfBytes } from '../support/upload-harness';

// The record pages in Chromium: attachments on the calc page, the verify page, the account's mail
// choices and the admins' sent mail. Attachments go to an s3rver started here.
let s3: Awaited<ReturnType<typeof startTestS3>>;
let session: Awaited<ReturnType<typeof startBrowserSession>>;
beforeAll(async () => {
  s3 = await startTestS3();
  Object.assign(process.env, s3.config);
  session = await startBrowserSession();
});
afterAll(async () => { await session?.close(); await s3?.close(); });

// Set-up goes through the same server the browser uses (supertest accepts its URL).
const server = () => session.baseUrl as unknown as Express;

async function signIn(page: Page, username: string) {
  await session.context.clearCookies();
  await page.goto('/sign-in');
  await page.getByLabel('Username').fill(username);
  await page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
}

describe('records in the browser', () => {
  it('when the author attaches a drawing on the calc page, then it is listed with its hash and the report link is there', async () => {
    const { author, calc } = await calcTeam(server());
    const page = await session.context.newPage();
    await signIn(page, author.user.username);
    await page.goto(`/calcs/${calc.id}`);
    await page.getByRole('tab', { name: 'Attachments' }).click();
    await page.getByLabel('File to attach').setInputFiles({ name: 'DRG-1 sheet 1.pdf', mimeType: 'application/pdf', buffer: pdfBytes(4000) });
    await page.getByRole('button', { name: 'Attach', exact: true }).click();
    await page.getByRole('link', { name: 'DRG-1 sheet 1.pdf' }).waitFor();
    expect(await page.getByRole('link', { name: 'Calc report (PDF)' }).getAttribute('href')).toBe(`/api/revisions/${calc.latest.id}/report.pdf`);
    await session.screenshot(page, 'calc-attachments');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });

  it('when a reader opens the verify link of an approved calc, then the page says it matches, with its signatures', async () => {
    const team = await calcTeam(server());
    await advanceTo('approved', { author: team.author.session, checker: team.checker.session, approver: team.approver.session }, team.revisionId);
    const hash = (await revisionOf(team.author.session, team.revisionId)).contentHash;
    const reader = await createTestUser(['admin']);
    const page = await session.context.newPage();
    await signIn(page, reader.username);
    await page.goto(`/verify/${hash}`);
    await page.getByRole('status').filter({ hasText: 'as stored now; valid signatures: authored, checked, approved' }).waitFor();
    await session.screenshot(page, 'verify-record');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });

  it('when someone turns a mail event off on their account page, then it stays off after a reload', async () => {
    const user = await createTestUser(['author']);
    const page = await session.context.newPage();
    await signIn(page, user.username);
    await page.goto('/account');
    const saved = page.waitForResponse((r) => r.url().endsWith('/api/mail/preferences') && r.request().method() === 'PUT');
    await page.getByRole('switch', { name: 'Your calc was approved' }).click();
    await saved;
    await page.reload();
    expect(await page.getByRole('switch', { name: 'Your calc was approved' }).getAttribute('aria-checked')).toBe('false');
    await session.screenshot(page, 'account-mail');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });

  it('when an admin opens sent mail, then queued hand-over mail is listed and one opens with its body', async () => {
    const team = await calcTeam(server());
    await advanceTo('in_check', { author: team.author.session, checker: team.checker.session, approver: team.approver.session }, team.revisionId);
    const admin = await createTestUser(['admin']);
    const page = await session.context.newPage();
    await signIn(page, admin.username);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sent mail' }).click();
    await page.getByRole('button', { name: new RegExp(`Ready for check: ${team.project.code}`) }).first().click();
    await page.getByText('Open it to check:').first().waitFor();
    await session.screenshot(page, 'sent-mail');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });
});
