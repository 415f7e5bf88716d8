import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { ManualItems } from './manual-items';

jest.setTimeout(30_000);

const MANUAL = [
  { id: 'material-certificate', text: 'Material certificate attached', requiresAttachment: 'material-certificate', done: false, by: null, note: null },
  { id: 'load-cases', text: 'Load cases match', requiresAttachment: null, done: false, by: null, note: null },
];
const REVISION = { id: 7, calcId: 3, status: 'in_check', manualItems: {}, checklist: { manual: MANUAL } } as unknown as RevisionDto;

let fixture: ComponentFixture<ManualItems>;
let http: HttpTestingController;

async function turn(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
  await fixture.whenStable();
}

beforeEach(async () => {
  TestBed.configureTestingModule({ providers: [provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()] });
  fixture = TestBed.createComponent(ManualItems);
  fixture.componentRef.setInput('revision', REVISION);
  fixture.componentRef.setInput('canTick', true);
  http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  await turn();
});
afterEach(() => http.verify());

const box = (label: RegExp) => TestbedHarnessEnvironment.loader(fixture).getHarness(MatCheckboxHarness.with({ label }));
const refuse = (url: string, message: string) => http.expectOne({ method: 'PUT', url })
  .flush({ code: 'conflict', message }, { status: 409, statusText: 'Conflict' });

describe('manual checklist items', () => {
  it('when the server refuses two ticks, then both boxes show unticked and each keeps its own reason', async () => {
    const certificate = await box(/Material certificate/);
    await certificate.check();
    refuse('/api/revisions/7/manual-items/material-certificate', 'Attach a material certificate first');
    await turn();
    const loads = await box(/Load cases/);
    await loads.check();
    refuse('/api/revisions/7/manual-items/load-cases', 'The revision changed since you opened it; reload it');
    await turn();

    expect(await certificate.isChecked()).toBe(false);
    expect(await loads.isChecked()).toBe(false);
    const alerts = [...(fixture.nativeElement as HTMLElement).querySelectorAll('[role="alert"]')].map((a) => a.textContent?.trim());
    expect(alerts).toEqual(['Not ticked: Attach a material certificate first', 'Not ticked: The revision changed since you opened it; reload it']);
  });

  it('when the server stores the tick, then the stored revision is passed on and the box stays ticked', async () => {
    const emitted: RevisionDto[] = [];
    fixture.componentInstance.changed.subscribe((r) => emitted.push(r));
    const loads = await box(/Load cases/);
    await loads.check();
    const stored = { ...REVISION, manualItems: { 'load-cases': { done: true, note: '', by: 'Idris Penhallow', at: '2026-12-01T10:00:00Z' } } };
    http.expectOne({ method: 'PUT', url: '/api/revisions/7/manual-items/load-cases' }).flush(stored);
    await turn();
    fixture.componentRef.setInput('revision', stored);
    await turn();

    expect(emitted).toHaveLength(1);
    expect(await (await box(/Load cases/)).isChecked()).toBe(true);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('ticked by Idris Penhallow');
  });
});
