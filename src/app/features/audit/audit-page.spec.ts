import { TestBed } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { AuditEventDto } from '../../../../shared/schemas/audit.schema';
import { errorInterceptor } from '../../core/http/error-interceptor';
import AuditPage from './audit-page';

const HASH = 'c'.repeat(64);
const ENTRY: AuditEventDto = {
  id: 41,
  occurredAt: '2026-12-01T09:30:00Z',
  actorId: 3,
  actorName: 'Idris Penhallow',
  action: 'revision.signed_checked',
  entityType: 'Revision',
  entityId: '7',
  record: { label: 'CV-12 rev B', link: '/calcs/5?revision=7' },
  payload: { revision: 'B' },
  diff: null,
  hasDiff: true,
  prevHash: 'b'.repeat(64),
  hash: HASH,
};

async function open(url: string) {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideRouter([{ path: 'audit', component: AuditPage }]),
    ],
  });
  const harness = await RouterTestingHarness.create();
  const navigation = harness.navigateByUrl(url);
  const http = TestBed.inject(HttpTestingController);
  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    TestBed.tick();
    harness.detectChanges();
  };
  /** The open request for the entry list (the page also reads its filter choices). */
  const listRequest = (): TestRequest => http.expectOne((r) => r.url === '/api/audit');
  await settle();
  // The filter choices: none needed here.
  http.match((r) => r.url === '/api/projects').forEach((r) => r.flush({ items: [], total: 0 }));
  http.match((r) => r.url === '/api/calcs').forEach((r) => r.flush({ items: [], total: 0 }));
  http.match((r) => r.url === '/api/audit/people').forEach((r) => r.flush([{ id: 3, name: 'Idris Penhallow' }]));
  await navigation;
  const element = harness.routeNativeElement as HTMLElement;
  return {
    http,
    settle,
    listRequest,
    element,
    text: () => element.textContent?.replace(/\s+/g, ' ').trim() ?? '',
    loader: TestbedHarnessEnvironment.loader(harness.fixture),
  };
}

const page = (items: AuditEventDto[]) => ({ items, size: 25, next: null, total: items.length, totalIsAtLeast: false });

describe('the audit trail page', () => {
  it('when filters arrive in the address, then only well-formed ones reach the server', async () => {
    const d = await open('/audit?calcId=7&action=revision.signed&from=12/01/2026&projectId=abc&userId=3');
    const params = d.listRequest().request.params;

    expect(params.keys().sort()).toEqual(['action', 'calcId', 'size', 'userId']);
    expect([params.get('calcId'), params.get('action'), params.get('userId')]).toEqual(['7', 'revision.signed', '3']);
  });

  it('when entries are listed, then each says what happened in words and names its record as a link', async () => {
    const d = await open('/audit');
    d.listRequest().flush(page([ENTRY]));
    await d.settle();

    expect(d.text()).toContain('signed as checked');
    expect(d.text()).not.toContain('revision.signed_checked');
    const link = d.element.querySelector<HTMLAnchorElement>('td a');
    expect(link?.textContent?.trim()).toBe('CV-12 rev B');
    expect(link?.getAttribute('href')).toBe('/calcs/5?revision=7');
    expect(d.text()).toContain('1 entry ');
  });

  it('when an entry is opened, then its code, hashes and changes are shown, the changes read on their own', async () => {
    const d = await open('/audit');
    d.listRequest().flush(page([ENTRY]));
    await d.settle();
    d.element.querySelector<HTMLButtonElement>('button.expander')!.click();
    await d.settle();
    d.http.expectOne('/api/audit/41').flush({ ...ENTRY, diff: '--- saved\n+++ new\n' });
    await d.settle();

    expect(d.text()).toContain('revision.signed_checked');
    expect(d.text()).toContain(HASH);
    expect(d.text()).toContain('b'.repeat(64));
  });

  it('when a date is typed the US way, then it is refused in words and the list is not filtered by it', async () => {
    const d = await open('/audit');
    d.listRequest().flush(page([ENTRY]));
    await d.settle();
    const from = await d.loader.getHarness(MatInputHarness.with({ placeholder: 'YYYY-MM-DD' }));
    await from.setValue('12/01/2026');
    await from.blur();
    await d.settle();

    d.http.expectNone((r) => r.url === '/api/audit');
    const field = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'From (UTC)' }));
    expect(await field.getTextErrors()).toEqual(['Write the date as YYYY-MM-DD']);

    // Typed without the harness: it waits for the page to be idle, and the new list request keeps it busy.
    const input = d.element.querySelector<HTMLInputElement>('input[placeholder="YYYY-MM-DD"]')!;
    input.value = '2026-12-01';
    input.dispatchEvent(new Event('input'));
    await d.settle();
    const params = d.listRequest().request.params;
    expect(params.get('from')).toBe('2026-12-01');
    expect(params.has('after')).toBe(false);
  });

  it('when the chain is verified and found broken, then the page says where and what to do', async () => {
    const d = await open('/audit');
    d.listRequest().flush(page([]));
    await d.settle();
    await (await d.loader.getHarness(MatButtonHarness.with({ text: /Verify the chain/ }))).click();
    d.http
      .expectOne('/api/audit/verify')
      .flush({ ok: false, checked: 41, brokenAt: 42, checkedAt: '2026-12-02T10:00:00Z' });
    await d.settle();

    expect(d.text()).toContain('Chain broken at entry 42 after 41 good entries. Report this to compliance at once.');
    expect(d.text()).toContain('No entries of this type yet');
  });
});
