import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { SignDialog, type SignDialogData } from './sign-dialog';

const FAILING_ROW = {
  clauseId: '6.1',
  clauseTitle: 'Fatigue safety',
  severity: 'mandatory',
  status: 'fail',
  location: { label: 'KS1 at 50 mm' },
  message: 'n = 1.497 is below 1.5',
};
function revision(over: Partial<RevisionDto> = {}): RevisionDto {
  return {
    id: 7,
    calcId: 3,
    status: 'in_check',
    verdict: 'compliant',
    lockVersion: 2,
    contentHash: 'ab'.repeat(32),
    result: {},
    findings: [],
    ruleSet: { id: 2, code: 'KFD-ENG-014', version: 3, title: 'Shaft design' },
    manualItems: {},
    checklist: { rows: [], manual: [{ id: 'load-cases', text: 'Load cases match' }] },
    ...over,
  } as unknown as RevisionDto;
}

let fixture: ComponentFixture<SignDialog>;
let http: HttpTestingController;

async function open(data: SignDialogData): Promise<void> {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: PureAbility, useValue: createAppAbility(defineRulesFor({ id: 1, roles: ['author', 'checker'] })) },
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatDialogRef, useValue: { close: jest.fn() } },
    ],
  });
  http = TestBed.inject(HttpTestingController);
  fixture = TestBed.createComponent(SignDialog);
  fixture.detectChanges();
  http.match('/api/auth/second-factor').forEach((r) => r.flush({ enrolled: false, required: false }));
  await fixture.whenStable();
  fixture.detectChanges();
}
const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
const loader = () => TestbedHarnessEnvironment.loader(fixture);

describe('the signing dialog', () => {
  it('when a manual item is still open, then the blocker shows before any password is asked for, and Sign is off', async () => {
    await open({ revision: revision(), meaning: 'checked', calcLabel: 'CV-7 rev A' });
    expect(text()).toContain('Tick the 1 open manual checklist item(s) first.');
    expect(await loader().getAllHarnesses(MatInputHarness.with({ selector: '[type="password"]' }))).toEqual([]);
    expect(await (await loader().getHarness(MatButtonHarness.with({ text: 'Sign' }))).isDisabled()).toBe(true);
  });

  it('when the author submits a calc failing a mandatory clause, then the dialog says which clause fails before signing', async () => {
    await open({
      revision: revision({
        status: 'draft',
        verdict: 'not-compliant',
        checklist: { rows: [FAILING_ROW], manual: [] } as never,
      }),
      meaning: 'authored',
      calcLabel: 'CV-7 rev A',
    });
    expect(text()).toContain('This calc fails 1 mandatory clause row of KFD-ENG-014 v3.');
    expect(text()).toContain('§6.1 Fatigue safety, KS1 at 50 mm: n = 1.497 is below 1.5');
    expect(await loader().getAllHarnesses(MatInputHarness.with({ selector: '[type="password"]' }))).toHaveLength(1);
  });

  it('when the password is wrong, then the one error is on the password field, not also a second message', async () => {
    await open({
      revision: revision({ status: 'draft', checklist: { rows: [], manual: [] } as never }),
      meaning: 'authored',
      calcLabel: 'CV-7 rev A',
    });
    await (await loader().getHarness(MatInputHarness.with({ selector: '[type="password"]' }))).setValue('not mine');
    await (await loader().getHarness(MatButtonHarness.with({ text: 'Sign' }))).click();
    http.expectOne({ method: 'POST', url: '/api/revisions/7/sign' }).flush(
      {
        code: 'validation',
        message: 'Password is not correct; nothing was signed',
        fieldErrors: { password: ['is not correct'] },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    const field = await loader().getHarness(MatFormFieldHarness);
    expect(await field.getTextErrors()).toEqual(['Password is not correct; nothing was signed']);
    expect((fixture.nativeElement as HTMLElement).querySelectorAll('[role="alert"]:not(mat-error)')).toHaveLength(0);
  });

  it('when the server refuses for another reason, then the message shows and the password field is left alone', async () => {
    await open({
      revision: revision({ status: 'draft', checklist: { rows: [], manual: [] } as never }),
      meaning: 'authored',
      calcLabel: 'CV-7 rev A',
    });
    const password = await loader().getHarness(MatInputHarness.with({ selector: '[type="password"]' }));
    await password.setValue('right one');
    await (await loader().getHarness(MatButtonHarness.with({ text: 'Sign' }))).click();
    http.expectOne({ method: 'POST', url: '/api/revisions/7/sign' }).flush(
      {
        code: 'conflict',
        message: 'The revision changed since you opened it; review the new content before signing',
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(text()).toContain('The revision changed since you opened it');
    expect(await (await loader().getHarness(MatFormFieldHarness)).getTextErrors()).toEqual([]);
    expect(await password.getValue()).toBe('right one');
  });
});
