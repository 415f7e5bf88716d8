import { accessibilityViolations, pageSettled } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { createTestUser } from '../support/api-harness';
import { advanceTo, calcTeam, revisionOf } from '../support/calc-harness';
import { pdfBytes } from '../support/upload-harness';

// The record pages in Chromium: attachments on the calc page, the verify page, the account's mail
// choices and the admins' sent mail. Attachments go to an s3rver started here.
const suite = browserSuite({ s3: true });

interface SentPage {
  items: { subject: string }[];
}

describe('records in the browser', () => {
  it('when the author attaches a drawing on the calc page, then it is listed with its hash and the report link is there', async () => {
    const { author, calc } = await calcTeam(suite.server());
    const page = await suite.session.context.newPage();
    await suite.signIn(page, author.user.username);
    await page.goto(`/calcs/${calc.id}`);
    await page.getByRole('tab', { name: 'Attachments' }).click();
    await page
      .getByLabel('File to attach')
      .setInputFiles({ name: 'DRG-1 sheet 1.pdf', mimeType: 'application/pdf', buffer: pdfBytes(4000) });
    await page.getByRole('button', { name: 'Attach', exact: true }).click();
    await page.getByRole('link', { name: 'DRG-1 sheet 1.pdf' }).waitFor();
    // The attachment set is signed content: the page reads the revision again after the upload.
    await pageSettled(page);
    expect(await page.getByRole('link', { name: 'Calc report (PDF)' }).getAttribute('href')).toBe(
      `/api/revisions/${calc.latest.id}/report.pdf`,
    );
    await suite.session.screenshot(page, 'calc-attachments');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });

  it('when a reader opens the verify link of an approved calc, then the page says it matches, with its signatures', async () => {
    const team = await calcTeam(suite.server());
    await advanceTo(
      'approved',
      { author: team.author.session, checker: team.checker.session, approver: team.approver.session },
      team.revisionId,
    );
    const hash = (await revisionOf(team.author.session, team.revisionId)).contentHash;
    const reader = await createTestUser(['admin']);
    const page = await suite.session.context.newPage();
    await suite.signIn(page, reader.username);
    await page.goto(`/verify/${hash}`);
    await page
      .getByRole('status')
      .filter({ hasText: 'as stored now; valid signatures: authored, checked, approved' })
      .waitFor();
    await pageSettled(page);
    await suite.session.screenshot(page, 'verify-record');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });

  it('when someone turns a mail event off on their account page, then it stays off after a reload', async () => {
    const user = await createTestUser(['author']);
    const page = await suite.session.context.newPage();
    await suite.signIn(page, user.username);
    await page.goto('/account');
    const saved = page.waitForResponse(
      (r) => r.url().endsWith('/api/mail/preferences') && r.request().method() === 'PUT',
    );
    await page.getByRole('switch', { name: 'Your calc was approved' }).click();
    await saved;
    await page.reload();
    expect(await page.getByRole('switch', { name: 'Your calc was approved' }).getAttribute('aria-checked')).toBe(
      'false',
    );
    await suite.session.screenshot(page, 'account-mail');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });

  it('when an admin opens sent mail, then queued hand-over mail is listed and one opens with its body', async () => {
    const team = await calcTeam(suite.server());
    await advanceTo(
      'in_check',
      { author: team.author.session, checker: team.checker.session, approver: team.approver.session },
      team.revisionId,
    );
    const admin = await createTestUser(['admin']);
    const page = await suite.session.context.newPage();
    await suite.signIn(page, admin.username);
    const handOver = 'Ready for check: ';
    // Each page the screen receives, read as it passes: API answers are `no-store`, so Chromium keeps no copy that
    // DevTools could hand over later (a Response's json() failed with "No data found for resource" in a full run).
    let received: ((page: SentPage) => void) | null = null;
    await page.route(
      (url) => url.pathname === '/api/mail/sent',
      async (route) => {
        const response = await route.fetch();
        const body = (await response.json()) as SentPage;
        await route.fulfill({ response, json: body });
        received?.(body);
      },
    );
    const listed = () => new Promise<SentPage>((resolve) => (received = resolve));
    const holdsOne = async (read: Promise<SentPage>) => (await read).items.some((m) => m.subject.startsWith(handOver));
    const first = listed();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sent mail' }).click();
    await first;
    // Only mail of one kind: other spec files queue other mail in bursts (every check mails every approver in the
    // database), which pushed the hand-overs to check beyond 40 pages during a busy run.
    await page.getByRole('combobox', { name: 'Kind' }).click();
    let read = listed();
    await page.getByRole('option', { name: 'Calc ready for check' }).click();
    // Specs beside this one queue mail too, newest first, and every submission is told to every checker in the
    // database: during a run, more mail than a page can arrive between two page turns, so this calc's mail may drift
    // out of reach. Any hand-over to check shows the same screen; this calc's submission makes sure there is one.
    // Each page is judged by the answer the screen received, not by what it has drawn so far (under load the rows
    // follow the answer a moment later).
    for (let turn = 0; !(await holdsOne(read)); turn++) {
      if (turn === 40) throw new Error(`no "${handOver}" mail in the first 40 pages`);
      read = listed();
      await page.getByRole('button', { name: 'Next page' }).click();
    }
    const mail = page.getByRole('button', { name: /Ready for check: / }).first();
    await mail.click();
    await page.getByText('Open it to check:').first().waitFor();
    await pageSettled(page);
    await suite.session.screenshot(page, 'sent-mail');
    expect(await accessibilityViolations(page)).toEqual([]);
    await page.close();
  });
});
