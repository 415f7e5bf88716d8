import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { ManualItems } from './manual-items';
import { mountComponent } from '../../../../../test/support/client-harness';

const MANUAL = [
  {
    id: 'material-certificate',
    text: 'Material certificate attached',
    requiresAttachment: 'material-certificate',
    done: false,
    by: null,
    note: null,
  },
  { id: 'load-cases', text: 'Load cases match', requiresAttachment: null, done: false, by: null, note: null },
];
const REVISION = {
  id: 7,
  calcId: 3,
  status: 'in_check',
  manualItems: {},
  checklist: { manual: MANUAL },
} as unknown as RevisionDto;

let d: Awaited<ReturnType<typeof mountComponent<ManualItems>>>;

beforeEach(async () => {
  d = await mountComponent(ManualItems, { inputs: { revision: REVISION, canTick: true } });
});
afterEach(() => d.http.verify());

const box = (label: RegExp) => d.loader.getHarness(MatCheckboxHarness.with({ label }));
const refuse = (url: string, message: string) =>
  d.http
    .expectOne({ method: 'PUT', url })
    .flush({ code: 'conflict', message }, { status: 409, statusText: 'Conflict' });

describe('manual checklist items', () => {
  it('when the server refuses two ticks, then both boxes show unticked and each keeps its own reason', async () => {
    const certificate = await box(/Material certificate/);
    await certificate.check();
    refuse('/api/revisions/7/manual-items/material-certificate', 'Attach a material certificate first');
    await d.settle();
    const loads = await box(/Load cases/);
    await loads.check();
    refuse('/api/revisions/7/manual-items/load-cases', 'The revision changed since you opened it; reload it');
    await d.settle();

    expect(await certificate.isChecked()).toBe(false);
    expect(await loads.isChecked()).toBe(false);
    const alerts = d.alerts();
    expect(alerts).toEqual([
      'Not ticked: Attach a material certificate first',
      'Not ticked: The revision changed since you opened it; reload it',
    ]);
  });

  it('when a tick is being stored, then no other box can be ticked until its answer is in', async () => {
    await (await box(/Load cases/)).check();
    expect(await (await box(/Material certificate/)).isDisabled()).toBe(true);
    d.http.expectOne({ method: 'PUT', url: '/api/revisions/7/manual-items/load-cases' }).flush(REVISION);
    await d.settle();
    expect(await (await box(/Material certificate/)).isDisabled()).toBe(false);
  });

  it('when the server stores the tick, then the stored revision is passed on and the box stays ticked', async () => {
    const emitted: RevisionDto[] = [];
    d.fixture.componentInstance.changed.subscribe((r) => emitted.push(r));
    const loads = await box(/Load cases/);
    await loads.check();
    const stored = {
      ...REVISION,
      manualItems: { 'load-cases': { done: true, note: '', by: 'Idris Penhallow', at: '2026-12-01T10:00:00Z' } },
    };
    d.http.expectOne({ method: 'PUT', url: '/api/revisions/7/manual-items/load-cases' }).flush(stored);
    await d.settle();
    d.fixture.componentRef.setInput('revision', stored);
    await d.settle();

    expect(emitted).toHaveLength(1);
    expect(await (await box(/Load cases/)).isChecked()).toBe(true);
    expect(d.element.textContent).toContain('ticked by Idris Penhallow');
  });
});
