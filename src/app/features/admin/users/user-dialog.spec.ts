import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { UserDto } from '../../../../../shared/schemas/user.schema';
import { dialogProviders, mountComponent, refusal } from '../../../../../test/support/client-harness';
import { UserDialog } from './user-dialog';

const EXISTING = {
  id: 5,
  username: 'idris.p',
  displayName: 'Idris Penhallow',
  email: 'idris@kestrelfen.example',
  roles: ['checker'],
  pendingRoles: ['approver'],
  active: true,
  secondFactorRequired: false,
  version: 3,
} as unknown as UserDto;

async function open(existing: UserDto | null) {
  const dialog = dialogProviders(existing);
  const mounted = await mountComponent(UserDialog, { providers: dialog.providers });
  const input = (label: string) =>
    mounted.loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${label}"]` }));
  const submit = () =>
    mounted.loader
      .getHarness(MatButtonHarness.with({ text: existing ? 'Save changes' : 'Create account' }))
      .then((b) => b.click());
  return { ...mounted, closed: dialog.closed, input, submit };
}

describe('the account dialog', () => {
  it('when a new account has a short password and no role, then nothing is sent and each problem is named', async () => {
    const d = await open(null);
    await (await d.input('username')).setValue('Bad Name');
    await (await d.input('displayName')).setValue('Tamsin Rowe');
    await (await d.input('email')).setValue('tamsin@kestrelfen.example');
    await (await d.input('initialPassword')).setValue('short');
    await d.submit();
    await d.settle();

    d.http.expectNone('/api/users');
    expect(d.alerts()).toEqual(['Give the person at least one role']);
    const username = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /Username/ }));
    expect(await username.getTextErrors()).toEqual([
      'Username may use lower-case letters, digits, dot, dash and underscore, starting with a letter or digit',
    ]);
    const password = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /First password/ }));
    expect(await password.getTextErrors()).toEqual(['First password must be at least 12 characters']);
    expect(d.closed).toEqual([]);
  });

  it('when a valid new account is created, then the chosen roles are sent in the standard order and the dialog closes with the stored account', async () => {
    const d = await open(null);
    await (await d.input('username')).setValue('tamsin.r');
    await (await d.input('displayName')).setValue('Tamsin Rowe');
    await (await d.input('email')).setValue('tamsin@kestrelfen.example');
    await (await d.input('initialPassword')).setValue('a long first password');
    await (await d.loader.getHarness(MatCheckboxHarness.with({ label: /^Approver/ }))).check();
    await (await d.loader.getHarness(MatCheckboxHarness.with({ label: /^Author/ }))).check();
    await d.submit();

    const req = d.http.expectOne({ method: 'POST', url: '/api/users' });
    expect(req.request.body).toEqual({
      username: 'tamsin.r',
      displayName: 'Tamsin Rowe',
      email: 'tamsin@kestrelfen.example',
      roles: ['author', 'approver'],
      initialPassword: 'a long first password',
    });
    req.flush({ ...EXISTING, id: 9, username: 'tamsin.r' });
    await d.settle();
    expect(d.closed).toEqual([expect.objectContaining({ id: 9, username: 'tamsin.r' })]);
  });

  it('when an account is changed, then the username is fixed, pending roles stay ticked and the stored version is sent', async () => {
    const d = await open(EXISTING);
    expect(await (await d.input('username')).isDisabled()).toBe(true);
    expect(await (await d.loader.getHarness(MatCheckboxHarness.with({ label: /^Approver/ }))).isChecked()).toBe(true);
    expect(d.text()).toContain("awaiting a second person's confirmation");
    await (await d.loader.getHarness(MatCheckboxHarness.with({ label: /one-time code/ }))).check();
    await d.submit();

    const req = d.http.expectOne({ method: 'PATCH', url: '/api/users/5' });
    expect(req.request.body).toEqual({
      displayName: 'Idris Penhallow',
      email: 'idris@kestrelfen.example',
      roles: ['checker', 'approver'],
      secondFactorRequired: true,
      version: 3,
    });
  });

  it('when the server refuses a field, then its reason shows under that field and the dialog stays open', async () => {
    const d = await open(EXISTING);
    await d.submit();
    d.http
      .expectOne({ method: 'PATCH', url: '/api/users/5' })
      .flush(...refusal(400, 'Invalid input', { email: ['This e-mail address is already used'] }));
    await d.settle();

    const email = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /E-mail/ }));
    expect(await email.getTextErrors()).toEqual(['This e-mail address is already used']);
    expect(d.closed).toEqual([]);
    expect(await (await d.loader.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).isDisabled()).toBe(false);
  });
});
