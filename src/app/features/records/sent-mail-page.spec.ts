import type { HttpRequest } from '@angular/common/http';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { SentMailDto } from '../../../../shared/schemas/mail.schema';
import { mountComponent } from '../../../../test/support/client-harness';
import SentMailPage from './sent-mail-page';

const mail = (id: number, event: string): SentMailDto => ({
  id,
  event,
  recipient: `person-${id}@example.test`,
  subject: `Mail ${id}`,
  status: 'sent',
  attempts: 1,
  createdAt: '2026-12-03T10:00:00Z',
  sentAt: '2026-12-03T10:00:01Z',
  nextAttemptAt: '2026-12-03T10:00:00Z',
  lastError: null,
  messageId: `<m${id}@example.test>`,
});
const answer = (page: number, items: SentMailDto[], total: number) => ({ items, total, page, size: 25 });
const isList = (page: number) => (r: HttpRequest<unknown>) =>
  r.url === '/api/mail/sent' && r.params.get('page') === String(page);

describe('the sent mail page', () => {
  it('when a kind is chosen on page 2, then the list returns to page 1, asks for that kind and names kinds in words', async () => {
    const d = await mountComponent(SentMailPage);
    const first = Array.from({ length: 25 }, (_, i) => mail(100 - i, i % 2 ? 'role_change' : 'checked'));
    (await d.request(isList(0))).flush(answer(0, first, 60));
    await d.settle();
    // The kinds read as a person's mail settings name them, never as the stored code.
    expect(d.text()).toContain('Calc ready for approval');
    expect(d.text()).toContain('Role changed');
    expect(d.text()).not.toMatch(/role_change|\bchecked\b/);

    const paginator = await d.loader.getHarness(MatPaginatorHarness);
    await d.answerDuring(() => paginator.goToNextPage(), isList(1), answer(1, [mail(75, 'submitted')], 60));
    const field = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Kind' }));
    const select = (await field.getControl(MatSelectHarness))!;
    await select.open();
    const choose = () => select.clickOptions({ text: 'Calc ready for check' });
    const sent = await d.answerDuring(choose, (r) => r.url === '/api/mail/sent', answer(0, [mail(7, 'submitted')], 1));

    expect([sent.params.get('event'), sent.params.get('page'), sent.params.get('status')]).toEqual([
      'submitted',
      '0',
      null,
    ]);
    expect(await paginator.getRangeLabel()).toBe('1 – 1 of 1');
    d.http.verify();
  });
});
