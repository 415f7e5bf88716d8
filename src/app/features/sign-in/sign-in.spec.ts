import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { PureAbility } from '@casl/ability';
import { createAppAbility } from '../../../../shared/authz/app-ability';
import SignIn from './sign-in';

let fixture: ComponentFixture<SignIn>;

describe('signing in', () => {
  it('when the password is wrong, then one error shows: the server\'s, not also "Enter your password"', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: PureAbility, useValue: createAppAbility([]) },
      ],
    });
    const http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignIn);
    fixture.detectChanges();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="username"]' }))
    ).setValue('mhale');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="password"]' }))
    ).setValue('wrong');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    http.expectOne('/api/session').flush({ user: null, rules: [], csrfToken: 'token' });
    await new Promise((resolve) => setTimeout(resolve));
    http
      .expectOne({ method: 'POST', url: '/api/auth/login' })
      .flush(
        { code: 'unauthorized', message: 'Username or password is not correct' },
        { status: 401, statusText: 'Unauthorized' },
      );
    await fixture.whenStable();
    fixture.detectChanges();

    const errors = await Promise.all((await loader.getAllHarnesses(MatFormFieldHarness)).map((f) => f.getTextErrors()));
    expect(errors.flat()).toEqual([]);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain(
      'Username or password is not correct',
    );
    expect(
      await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="username"]' }))).getValue(),
    ).toBe('mhale');
  });
});
