import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { SessionStore } from '../../../core/auth/session-store';
import { EDITOR_DEBOUNCE_MS } from '../editor/editor-support';
import { panelsBuilt } from '../../../../../test/support/editor-harness';
import ModelEditor from './model-editor';

const CHECKER = { id: 2, username: 'tokafor', displayName: 'Tobias Okafor', roles: ['checker'] };
const need = {
  method: 'independent-model',
  reason: 'KFD-ENG-021 asks for a model',
  tolerances: { inputs: 0.001, results: 0.02 },
};
const REVISION = {
  id: 7,
  calcId: 3,
  label: 'A',
  status: 'in_check',
  verdict: null,
  result: null,
  input: {},
  findings: [],
  manualItems: {},
  editorIds: [1],
  author: { id: 1, name: 'Morwenna Hale' },
  checker: null,
  checklist: null,
  ruleSet: { id: 4, code: 'KFD-ENG-021', version: 2 },
  lockVersion: 3,
  verification: { need, blind: true, model: null, signed: null },
};
const MODEL = {
  id: 11,
  revisionId: 7,
  checker: { id: 2, name: 'Tobias Okafor' },
  state: 'open',
  input: { units: 'SI', segments: [{ length: 100, od: 41.3, id: 0 }], torques: [] },
  result: null,
  checklist: null,
  verdict: null,
  inputIssues: [],
  lockedAt: null,
  modelHash: null,
  authorHash: null,
  comparison: null,
  agrees: null,
  lockVersion: 2,
  updatedAt: '2026-12-02T10:00:00Z',
};

let fixture: ComponentFixture<ModelEditor>;
let http: HttpTestingController;
const text = () => (fixture.nativeElement as HTMLElement).textContent?.replace(/\s+/g, ' ') ?? '';
const turn = async () => {
  fixture.detectChanges();
  await new Promise((r) => setTimeout(r));
  fixture.detectChanges();
};

/** Opens the page as the checker; `model` is their stored draft, if they have one. */
async function open(model: typeof MODEL | null): Promise<void> {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: PureAbility, useValue: createAppAbility(defineRulesFor({ id: 2, roles: ['checker'] })) },
      { provide: EDITOR_DEBOUNCE_MS, useValue: 0 },
    ],
  });
  http = TestBed.inject(HttpTestingController);
  const session = TestBed.inject(SessionStore).load();
  http.expectOne('/api/session').flush({ user: CHECKER, rules: [], csrfToken: 't' });
  await session;
  fixture = TestBed.createComponent(ModelEditor);
  fixture.componentRef.setInput('id', 7);
  await turn();
  const summary = model && { state: 'open', checker: model.checker, lockedAt: null, agrees: null, differences: null };
  http.expectOne('/api/revisions/7').flush({ ...REVISION, verification: { ...REVISION.verification, model: summary } });
  await turn();
  http.expectOne('/api/calcs/3').flush({ id: 3, number: 'CV1200-SH-005', title: 'Head shaft', partRef: 'KFD-DRG-118' });
  http.expectOne('/api/rule-sets/4').flush({ id: 4, document: {} });
  if (model) http.expectOne('/api/revisions/7/independent-model').flush(model);
  await turn();
  http
    .match('/api/revisions/7/attachments')
    .forEach((r) => r.flush({ items: [], canAdd: true, maxBytes: 1, acceptedTypes: [] }));
  await turn();
  await panelsBuilt(fixture.nativeElement as HTMLElement, turn);
}

const field = (path: string) =>
  (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>(`[data-path="${path}"]`)!;
const button = (name: string) =>
  Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('button')).find((b) =>
    b.textContent?.includes(name),
  )!;

afterEach(() => http?.verify());

describe("the checker's model editor", () => {
  it("when a blind checker opens it without a draft, then the form is empty of the author's numbers and the title block shows", async () => {
    await open(null);
    expect(text()).toContain('CV1200-SH-005 · Head shaft');
    expect(text()).toContain('Drawing / part KFD-DRG-118');
    expect(text()).toContain('You check this calc blind');
    expect(field('segments[0].od').value).toBe('');
    expect(text()).toContain('Not saved yet');
    // The panels speak to whoever builds the model: no "for the checker" or "by the author" on the checker's page.
    expect(text()).toContain('Notes on your independent model');
    expect(text()).not.toMatch(/Notes for the checker|Entered by the author/);
  });

  it('when the stored draft moved on since it was opened, then saving says so, keeps the typing, and offers the stored draft', async () => {
    await open(MODEL);
    expect(field('segments[0].od').value).toBe('41.3');
    field('segments[0].od').value = '42';
    field('segments[0].od').dispatchEvent(new Event('input'));
    await turn();
    expect(text()).toContain('Unsaved changes');
    button('Save draft').click();
    const put = http.expectOne({ method: 'PUT', url: '/api/revisions/7/independent-model' });
    expect(put.request.body.lockVersion).toBe(2);
    expect(put.request.body.input.segments[0].od).toBe(42);
    put.flush(
      { code: 'conflict', message: 'The independent model changed since you opened it (another tab?); reload it' },
      { status: 409, statusText: 'Conflict' },
    );
    await turn();
    expect(text()).toContain('changed since you opened it');
    expect(field('segments[0].od').value).toBe('42');

    button('Load the stored draft').click();
    await turn();
    http.expectOne('/api/revisions/7').flush({
      ...REVISION,
      verification: {
        ...REVISION.verification,
        model: { state: 'open', checker: MODEL.checker, lockedAt: null, agrees: null, differences: null },
      },
    });
    http
      .expectOne('/api/revisions/7/independent-model')
      .flush({ ...MODEL, lockVersion: 3, input: { ...MODEL.input, segments: [{ length: 100, od: 43, id: 0 }] } });
    await turn();
    http
      .match('/api/revisions/7/attachments')
      .forEach((r) => r.flush({ items: [], canAdd: true, maxBytes: 1, acceptedTypes: [] }));
    await turn();
    expect(field('segments[0].od').value).toBe('43');
    expect(text()).toContain('draft version 3');
  });

  // Where focus lands when the question opens needs layout (CDK's focus trap skips what it cannot see): the browser
  // spec of the independent model checks that "Not yet" has it.
  it('when the lock question is open, then Escape closes it and focus returns to "Lock and compare"', async () => {
    await open(MODEL);
    const lockButton = button('Lock and compare');
    lockButton.focus();
    lockButton.click();
    await turn();
    await fixture.whenStable();
    const dialog = (fixture.nativeElement as HTMLElement).querySelector('[role="alertdialog"]')!;
    expect(dialog.textContent).toContain('Nobody can change it afterwards');

    dialog.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape', bubbles: true }));
    await turn();
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alertdialog"]')).toBeNull();
    expect(document.activeElement).toBe(lockButton);
  });
});
