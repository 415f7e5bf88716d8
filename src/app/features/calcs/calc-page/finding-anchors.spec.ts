import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { Checklist } from '../../../../../shared/rules';
import type { FindingDto, RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { ChecklistTable } from '../checklist/checklist-table';
import { FindingsPanel } from './findings-panel';

const row = (clauseId: string, title: string, index: number | null, label: string) => ({
  clauseId,
  clauseTitle: title,
  severity: 'mandatory',
  status: 'pass',
  location: { scope: index === null ? 'shaft' : 'segment', index, label },
  actual: 1,
  limit: 2,
  unit: '1',
  utilisation: 0.5,
  utilisationBasis: null,
  message: '',
  warnings: [],
});
const CHECKLIST = {
  rows: [
    row('3.1', 'Fatigue assessment required', null, 'whole shaft'),
    row('5.1', 'Yield safety factor', 0, 'segment 1 (0–100 mm)'),
    row('5.1', 'Yield safety factor', 1, 'segment 2 (100–300 mm)'),
  ],
  manual: [],
} as unknown as Checklist;
const person = { id: 2, name: 'Idris Penhallow' };
const finding = (id: number, clauseRef: string | null, anchorPath: string | null): FindingDto => ({
  id,
  clauseRef,
  anchorPath,
  text: `Point ${id}`,
  status: 'open',
  raisedBy: person,
  createdAt: '2026-12-01T10:00:00Z',
  answer: null,
  answeredBy: null,
  answeredAt: null,
  closedBy: null,
  closedAt: null,
});
const REVISION = {
  id: 7,
  calcId: 3,
  status: 'in_check',
  checklist: CHECKLIST,
  author: { id: 1, name: 'Morwenna Hale' },
  input: { segments: [{ od: 40 }, { od: 50 }], features: [{ type: 'keyseat' }], material: { E: 207 } },
  findings: [finding(3, '5.1', 'segments[1]'), finding(4, null, 'features[0].Kts'), finding(5, null, null)],
} as unknown as RevisionDto;

let fixture: ComponentFixture<FindingsPanel>;
let http: HttpTestingController;

beforeEach(async () => {
  TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
  fixture = TestBed.createComponent(FindingsPanel);
  fixture.componentRef.setInput('revision', REVISION);
  fixture.componentRef.setInput('canRaise', true);
  http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  await fixture.whenStable();
});
afterEach(() => http.verify());

describe('findings anchored to a row or an input', () => {
  it('when findings have anchors, then each names its place as the screen does', () => {
    const places = [...(fixture.nativeElement as HTMLElement).querySelectorAll('.findings .ref')].map((e) =>
      e.textContent!.trim(),
    );
    expect(places).toEqual(['§5.1, Segment 2', 'Feature KS1, Kts', 'the calc as a whole']);
  });

  it('when the checker picks a checklist row under "Concerns", then the finding is sent with that clause and location', async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const concerns = await loader.getHarness(MatSelectHarness.with({ selector: '.concerns mat-select' }));
    await concerns.open();
    const labels = await Promise.all((await concerns.getOptions()).map((o) => o.getText()));
    expect(labels).toEqual([
      'The calc as a whole',
      '§3.1 Fatigue assessment required — whole shaft',
      '§5.1 Yield safety factor — segment 1 (0–100 mm)',
      '§5.1 Yield safety factor — segment 2 (100–300 mm)',
      'Segment 1',
      'Segment 2',
      'Feature KS1',
      'Material',
    ]);
    await concerns.clickOptions({ text: '§5.1 Yield safety factor — segment 2 (100–300 mm)' });
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '.raise textarea' }))
    ).setValue('Yield n needs the notch');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Raise finding' }))).click();
    const req = http.expectOne({ method: 'POST', url: '/api/revisions/7/findings' });
    expect(req.request.body).toEqual({ text: 'Yield n needs the notch', clauseRef: '5.1', anchorPath: 'segments[1]' });
    req.flush(REVISION);
  });

  it('when a finding is anchored to a row, then the checklist table shows it on that row only', async () => {
    const table = TestBed.createComponent(ChecklistTable);
    table.componentRef.setInput('checklist', CHECKLIST);
    table.componentRef.setInput('findings', REVISION.findings);
    table.detectChanges();
    await table.whenStable();
    const perRow = [...(table.nativeElement as HTMLElement).querySelectorAll('tr[mat-row]')].map((tr) =>
      [...tr.querySelectorAll('.finding')].map((f) => f.textContent!.replace(/\s+/g, ' ').trim()),
    );
    expect(perRow).toEqual([[], [], ['F3 open: Point 3']]);
  });

  it('when a finding is anchored to a row that does not apply, then that row stays in view with it', async () => {
    const table = TestBed.createComponent(ChecklistTable);
    const notApplicable = { ...CHECKLIST.rows[2], status: 'not-applicable' };
    table.componentRef.setInput('checklist', { ...CHECKLIST, rows: [CHECKLIST.rows[0], notApplicable] });
    table.componentRef.setInput('findings', REVISION.findings);
    table.detectChanges();
    await table.whenStable();
    expect((table.nativeElement as HTMLElement).querySelectorAll('tr[mat-row]')).toHaveLength(2);
    expect((table.nativeElement as HTMLElement).querySelector('.finding')!.textContent).toContain('F3');
  });
});
