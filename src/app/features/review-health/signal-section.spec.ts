import { provideRouter } from '@angular/router';
import type { SignalPage, SignalRow } from '../../../../shared/schemas/review-health.schema';
import { mountComponent, refusal } from '../../../../test/support/client-harness';
import { SignalSection } from './signal-section';

const PARAMS = { projectId: 7, from: '2026-09-01', to: '2026-12-01' };
const row = (i: number): SignalRow => ({
  signal: 'quick-check',
  fact: `Checked in ${i} seconds: 4 checklist rows, 5 segments, 1 feature`,
  projectCode: 'KFD-B01',
  calcId: i,
  calcNumber: `KFD-${i}`,
  revision: 'A',
  people: 'checker Ines Baptiste; author Tomas Reyes',
  at: '2026-11-30T10:00:00.000Z',
  measure: 0.2,
  evidence: [{ label: 'Submission and check signatures', query: { calcId: String(i), action: 'revision.signed' } }],
});
const FIRST: SignalPage = { key: 'quick-check', rows: [row(1), row(2)], total: 5, next: 'c2' };

let ui: Awaited<ReturnType<typeof mountComponent<SignalSection>>>;
const facts = () => Array.from(ui.element.querySelectorAll('.fact')).map((f) => f.textContent!.trim());
const moreButton = () => Array.from(ui.element.querySelectorAll('button')).find((b) => /more/.test(b.textContent!));
const pageRequest = () => ui.http.expectOne((r) => r.url === '/api/review-health/signals/quick-check');

beforeEach(async () => {
  ui = await mountComponent(SignalSection, { inputs: { page: FIRST, params: PARAMS }, providers: [provideRouter([])] });
});
afterEach(() => ui.http.verify());

describe('one signal, paged', () => {
  it('when the first page is shown, then the count is the total and it says how many of how many are shown', () => {
    expect(ui.text()).toContain('5 observations');
    expect(ui.text()).toContain('2 of 5 shown; the CSV export has every one.');
    expect(facts()).toHaveLength(2);
  });

  it('when more are asked for, then the next page is read after the cursor for the same project and period', async () => {
    moreButton()!.click();
    const req = pageRequest();
    expect(req.request.params.toString()).toBe('projectId=7&from=2026-09-01&to=2026-12-01&after=c2');
    req.flush({ key: 'quick-check', rows: [row(3), row(4), row(5)], total: 3, next: null });
    await ui.settle();
    expect(facts().map((f) => f.match(/\d+/)![0])).toEqual(['1', '2', '3', '4', '5']);
    expect(moreButton()).toBeUndefined();
  });

  it('when the next page cannot be read, then the rows shown stay and the reason is given', async () => {
    moreButton()!.click();
    pageRequest().flush(...refusal(400, 'The page cursor is not valid for this list'));
    await ui.settle();
    await ui.settle();
    expect(facts()).toHaveLength(2);
    expect(ui.alerts().join(' ')).toContain('The page cursor is not valid for this list');
  });

  it('when a new report arrives, then its first page replaces the rows shown', async () => {
    ui.fixture.componentRef.setInput('page', { key: 'quick-check', rows: [row(9)], total: 1, next: null });
    await ui.settle();
    expect(facts()).toHaveLength(1);
    expect(ui.text()).toContain('1 observation');
    expect(moreButton()).toBeUndefined();
  });
});
