import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import { evaluateShaft, formatNumber } from '../../../../../shared/engine';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import ruleSetDocument from '../../../../../rules/kfd-eng-014-v3.json';
import RevisionEditor from './revision-editor';
import { panelsBuilt, TWO_STEP_SHAFT } from '../../../../../test/support/editor-harness';
import { EDITOR_DEBOUNCE_MS } from './editor-support';

// An invented two-step head shaft with a keyseat: small enough to read, complete enough to evaluate.
const INPUT = {
  ...TWO_STEP_SHAFT,
  torques: [
    { at: 50, T: 1500 },
    { at: 350, T: -1500 },
  ],
  features: [{ type: 'keyseat', form: 'end-mill', at: 50 }],
  bending: [],
};
const ME = { id: 1, roles: ['author'] as const };

function revision(over: Partial<RevisionDto> = {}): RevisionDto {
  return {
    id: 7,
    calcId: 3,
    seq: 0,
    contentFormat: 2,
    label: 'A',
    status: 'draft',
    verdict: null,
    author: { id: ME.id, name: 'Morwenna Hale' },
    checker: null,
    approver: null,
    ruleSet: { id: 2, code: 'KFD-ENG-014', version: 3, title: 'Shaft design' },
    reasonForChange: 'first issue',
    updatedAt: '2026-12-01T10:00:00Z',
    approvedAt: null,
    lockVersion: 0,
    input: JSON.parse(JSON.stringify(INPUT)),
    result: null,
    checklist: null,
    inputIssues: [],
    manualItems: {},
    contentHash: null,
    signatures: [],
    findings: [],
    submittedAt: null,
    checkedAt: null,
    createdAt: '2026-12-01T09:00:00Z',
    editorIds: [ME.id],
    ...over,
  };
}

let fixture: ComponentFixture<RevisionEditor>;
let http: HttpTestingController;
let loader: HarnessLoader;

/** Lets promises and effects run (an event-loop turn, not a wait), then whenStable once nothing is in flight. */
async function turn(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
}

async function settle(): Promise<void> {
  await turn();
  await fixture.whenStable();
}

/** Opens the editor on revision 7 and answers its reads (revision, rule set, calc heading). */
async function open(stored = revision()): Promise<void> {
  fixture = TestBed.createComponent(RevisionEditor);
  fixture.componentRef.setInput('id', 7);
  http = TestBed.inject(HttpTestingController);
  loader = TestbedHarnessEnvironment.loader(fixture);
  fixture.detectChanges();
  http.expectOne('/api/revisions/7').flush(stored);
  await turn();
  http.expectOne('/api/rule-sets/2').flush({ document: ruleSetDocument });
  await turn();
  http.expectOne('/api/calcs/3').flush({ number: 'CV-7', title: 'Head shaft' });
  await settle();
  await panelsBuilt(fixture.nativeElement as HTMLElement, settle);
}

async function cell(column: string, row = 0): Promise<string> {
  const table = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Results per segment"]' }));
  return (await table.getCellTextByColumnName())[column].text[row];
}

const segmentField = (path: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-path="${path}"]` }));

beforeEach(() => {
  localStorage.clear();
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: PureAbility, useValue: createAppAbility(defineRulesFor({ id: ME.id, roles: [...ME.roles] })) },
      { provide: EDITOR_DEBOUNCE_MS, useValue: 0 },
      // Dialogs close on an animation event jsdom never fires; without animations they close at once.
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
    ],
  });
});

afterEach(() => http?.verify());

describe('the calc editor, live in the browser', () => {
  it('when the author changes a segment diameter, then τmax in the results is recomputed by the shared engine', async () => {
    await open();
    const before = evaluateShaft(INPUT).segments[0].tauMax;
    expect(await cell('tauMax')).toBe(formatNumber(before, 4));

    await (await segmentField('segments[0].od')).setValue('75');
    await settle();

    const after = evaluateShaft({ ...INPUT, segments: [{ ...INPUT.segments[0], od: 75 }, INPUT.segments[1]] })
      .segments[0].tauMax;
    expect(after).toBeLessThan(before);
    expect(await cell('tauMax')).toBe(formatNumber(after, 4));
  });

  it('when a diameter is typed as 1e2, then on leaving the field it reads 100 and the calc uses 100', async () => {
    await open();
    const od = await segmentField('segments[0].od');
    await od.setValue('0.75e2');
    await od.blur();
    await settle();

    expect(await od.getValue()).toBe('75');
    const after = evaluateShaft({ ...INPUT, segments: [{ ...INPUT.segments[0], od: 75 }, INPUT.segments[1]] })
      .segments[0].tauMax;
    expect(await cell('tauMax')).toBe(formatNumber(after, 4));
  });

  it("when an inner diameter is not below the outer one, then the engine message shows on that row's field", async () => {
    await open();
    await (await segmentField('segments[1].id')).setValue('80');
    await settle();

    const field = await loader.getHarness(MatFormFieldHarness.with({ selector: '[data-field="segments[1].id"]' }));
    expect(await field.getTextErrors()).toEqual(['inner diameter 80 mm is not smaller than outer diameter 70 mm']);
    expect(await field.isControlValid()).toBe(false);
    expect(fixture.nativeElement.textContent).toContain(
      'Inner ⌀: inner diameter 80 mm is not smaller than outer diameter 70 mm',
    );
    expect(fixture.nativeElement.textContent).toContain('Results below are for the last valid input');
    expect(fixture.nativeElement.textContent).not.toMatch(/NaN|Infinity/);
  });
});

describe('who may edit', () => {
  it('when the revision is approved, then every field is read-only, there is no save, and results still show', async () => {
    await open(revision({ status: 'approved' }));
    expect(await (await segmentField('segments[0].od')).isDisabled()).toBe(true);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Save revision/ }))).toEqual([]);
    expect(fixture.nativeElement.textContent).toContain('Read-only: the revision is approved');
    expect(await cell('tauMax')).toBe(formatNumber(evaluateShaft(INPUT).segments[0].tauMax, 4));
  });
});

describe('saving and keeping work', () => {
  it('when the save meets a newer stored version (409), then both versions are shown side by side and nothing is overwritten', async () => {
    await open();
    await (await segmentField('segments[0].length')).setValue('120');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save revision/ }))).click();
    const theirs = revision({
      lockVersion: 1,
      input: { ...JSON.parse(JSON.stringify(INPUT)), notes: 'changed in another tab' },
    });
    const put = http.expectOne({ method: 'PUT', url: '/api/revisions/7' });
    expect(put.request.body.lockVersion).toBe(0);
    put.flush(
      { code: 'conflict', message: 'saved elsewhere', current: theirs },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();

    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    const text = await (await dialog.host()).text();
    expect(text).toContain('This revision was saved elsewhere');
    expect(text).toMatch(/Segment 1, length\s*120\s*100/);
    expect(text).toContain('changed in another tab');

    await (await dialog.getHarness(MatButtonHarness.with({ text: /Keep mine/ }))).click();
    await turn();
    const again = http.expectOne({ method: 'PUT', url: '/api/revisions/7' });
    expect(again.request.body.lockVersion).toBe(1);
    again.flush(revision({ lockVersion: 2, input: again.request.body.input }));
    await settle();
    expect(localStorage.length).toBe(0);
  });

  it('when the page is reloaded with unsaved edits, then the local copy is offered and restores them', async () => {
    await open();
    await (await segmentField('segments[1].od')).setValue('72');
    await settle();
    fixture.destroy();

    await open();
    expect(fixture.nativeElement.textContent).toContain('This browser kept unsaved changes');
    expect(await (await segmentField('segments[1].od')).getValue()).toBe('70');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Restore my changes' }))).click();
    await settle();
    expect(await (await segmentField('segments[1].od')).getValue()).toBe('72');
  });

  it('when the author leaves with unsaved changes, then the guard asks first; with none it lets them go', async () => {
    await open();
    expect(await fixture.componentInstance.confirmLeave()).toBe(true);
    await (await segmentField('segments[0].label')).setValue('drive end');
    const leaving = fixture.componentInstance.confirmLeave();
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Leave without saving?');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Stay here' }))).click();
    expect(await leaving).toBe(false);
  });

  it('when the author chooses "Save and leave", then the revision is saved first and only then do they leave', async () => {
    await open();
    await (await segmentField('segments[0].label')).setValue('drive end');
    const leaving = fixture.componentInstance.confirmLeave();
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save and leave' }))).click();
    await turn();
    const put = http.expectOne({ method: 'PUT', url: '/api/revisions/7' });
    expect(put.request.body.input.segments[0].label).toBe('drive end');
    put.flush(revision({ lockVersion: 1, input: put.request.body.input }));
    expect(await leaving).toBe(true);
  });

  it('when "Save and leave" is refused by the server, then the author stays with the edits and the reason', async () => {
    await open();
    await (await segmentField('segments[0].label')).setValue('drive end');
    const leaving = fixture.componentInstance.confirmLeave();
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save and leave' }))).click();
    await turn();
    http
      .expectOne({ method: 'PUT', url: '/api/revisions/7' })
      .flush(
        { code: 'validation', message: 'Invalid input', fieldErrors: { 'input.segments': ['is too long'] } },
        { status: 400, statusText: 'Bad Request' },
      );
    expect(await leaving).toBe(false);
    expect(await (await segmentField('segments[0].label')).getValue()).toBe('drive end');
  });
});
