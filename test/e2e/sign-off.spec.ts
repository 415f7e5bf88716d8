import type { Page } from 'playwright-core';
import { accessibilityViolations, pageSettled } from '../support/browser';
import { browserSuite } from '../support/browser-suite';
import { createTestProject, createTestUser, TEST_PASSWORD } from '../support/api-harness';
import { demoDocument } from '../../server/db/demo/demo-files';

const suite = browserSuite();

async function signDialog(page: Page, button: RegExp | string) {
  await page.getByRole('button', { name: button }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Your password').fill(TEST_PASSWORD);
  await dialog.getByRole('button', { name: 'Sign', exact: true }).click();
  await dialog.waitFor({ state: 'detached' });
}

async function attach(page: Page, kind: string, name: string) {
  await page.getByRole('tab', { name: 'Attachments' }).click();
  await page.getByLabel('Kind').click();
  await page.getByRole('option', { name: kind }).click();
  await page.getByLabel('File to attach').setInputFiles({
    name,
    mimeType: 'application/pdf',
    buffer: await demoDocument(kind, ['Invented for an end-to-end test']),
  });
  await page.getByRole('button', { name: 'Attach', exact: true }).click();
  await page.getByRole('link', { name }).waitFor();
}

describe('one calc from draft to approved, by three people', () => {
  it('when author, checker and approver each do their part in the browser, then the calc is approved with three valid signatures', async () => {
    const project = await createTestProject({ name: 'Walkthrough drive' });
    const [author, checker, approver] = await Promise.all([
      createTestUser(['author'], 'e2e-author'),
      createTestUser(['checker'], 'e2e-checker'),
      createTestUser(['approver'], 'e2e-approver'),
    ]);

    // Author: start the calc, attach the documents the standard asks for, sign and submit.
    let page = await suite.signedInPage(author.username);
    await page.goto(`/projects/${project.id}`);
    await page.getByRole('button', { name: 'New calc' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Calc number').fill('WT-SH-001');
    await dialog.getByLabel('Title').fill('Walkthrough drive shaft');
    await dialog.getByLabel('Design standard').click();
    await page.getByRole('option', { name: /KFD-ENG-014 v4/ }).click();
    await dialog.getByRole('button', { name: 'Create and open' }).click();
    await page.waitForURL(/\/revisions\/\d+\/edit/);
    const revisionId = Number(/revisions\/(\d+)/.exec(page.url())![1]);
    // The editor is ready once the live calc has given its verdict.
    await page
      .getByText(/Meets|Does not meet/)
      .first()
      .waitFor();
    await suite.session.screenshot(page, 'walk-1-editor');
    await page.goto(`/calcs/${(await (await page.request.get(`/api/revisions/${revisionId}`)).json()).calcId}`);
    const calcUrl = page.url();
    await attach(page, 'Drawing', 'WT-SH-001-drawing.pdf');
    await attach(page, 'Material certificate', 'WT-SH-001-certificate.pdf');
    await signDialog(page, /Sign and submit for check/);
    await page.getByText('In check').first().waitFor();
    await suite.session.screenshot(page, 'walk-2-submitted');

    // Checker: tick the manual items and sign as checked.
    page = await suite.signedInPage(checker.username);
    await page.getByRole('heading', { name: /Waiting for my check/ }).waitFor();
    await page.goto(calcUrl);
    for (const item of ['Material certificate attached', 'Load cases match', 'Drawing reference matches']) {
      const box = page.getByRole('checkbox', { name: new RegExp(item) });
      await box.check();
      // The tick is a stored record: wait until the server's answer names who ticked it.
      await page
        .getByRole('listitem')
        .filter({ has: box })
        .getByText(/^ticked by /)
        .waitFor();
    }
    await pageSettled(page);
    await suite.session.screenshot(page, 'walk-3-checker');
    expect(await accessibilityViolations(page)).toEqual([]);
    await signDialog(page, /Sign as checked/);
    await page.getByText('Waiting for approval by someone other than its checker.').waitFor();

    // Approver: approve.
    page = await suite.signedInPage(approver.username);
    await page.goto(calcUrl);
    await signDialog(page, /^Approve$/);
    await page.getByText('Released.').waitFor();
    await page.getByRole('tab', { name: 'Signatures' }).click();
    await suite.session.screenshot(page, 'walk-4-approved');

    const final = await (await page.request.get(`/api/revisions/${revisionId}`)).json();
    expect(final.status).toBe('approved');
    expect(final.signatures.map((s: { meaning: string; isValid: boolean }) => `${s.meaning}:${s.isValid}`)).toEqual([
      'authored:true',
      'checked:true',
      'approved:true',
    ]);
    expect(suite.session.outsideRequests).toEqual([]);
  });
});
