import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { mountComponent, refusal } from '../../../../test/support/client-harness';
import { SecondFactorPanel } from './second-factor-panel';

const STATUS_URL = '/api/auth/second-factor';

async function mount(status: { enrolled: boolean; required: boolean }) {
  const d = await mountComponent(SecondFactorPanel);
  d.http.expectOne({ method: 'GET', url: STATUS_URL }).flush(status);
  await d.settle();
  const button = (text: string) => d.loader.getHarness(MatButtonHarness.with({ text }));
  return { ...d, button };
}

describe('the one-time code panel', () => {
  it('when the person sets up a code, then Confirm waits for six digits and the confirmed status replaces the set-up', async () => {
    const d = await mount({ enrolled: false, required: false });
    await (await d.button('Set up')).click();
    d.http
      .expectOne({ method: 'POST', url: `${STATUS_URL}/begin` })
      .flush({ secret: 'JBSWY3DPEHPK3PXP', qrDataUrl: 'data:image/png;base64,AA==' });
    await d.settle();
    expect(d.text()).toContain('JBSWY3DPEHPK3PXP');
    const code = await d.loader.getHarness(MatInputHarness.with({ selector: '[autocomplete="one-time-code"]' }));
    await code.setValue('12345');
    expect(await (await d.button('Confirm')).isDisabled()).toBe(true);
    await code.setValue('123456');
    await (await d.button('Confirm')).click();

    const req = d.http.expectOne({ method: 'POST', url: `${STATUS_URL}/confirm` });
    expect(req.request.body).toEqual({ code: '123456' });
    req.flush({ enrolled: true, required: false });
    await d.settle();
    expect(d.text()).toContain('Your signatures ask for a code from your authenticator app');
    d.http.verify();
  });

  it('when the code is wrong, then the reason shows and the set-up stays open', async () => {
    const d = await mount({ enrolled: false, required: true });
    expect(d.text()).toContain('An administrator requires a one-time code');
    await (await d.button('Set up')).click();
    d.http
      .expectOne(`${STATUS_URL}/begin`)
      .flush({ secret: 'JBSWY3DPEHPK3PXP', qrDataUrl: 'data:image/png;base64,AA==' });
    await d.settle();
    await (
      await d.loader.getHarness(MatInputHarness.with({ selector: '[autocomplete="one-time-code"]' }))
    ).setValue('000000');
    await (await d.button('Confirm')).click();
    d.http
      .expectOne(`${STATUS_URL}/confirm`)
      .flush(...refusal(400, 'Invalid input', { code: ['The code does not match; try the next one'] }));
    await d.settle();

    expect(d.alerts()).toEqual(['Code: The code does not match; try the next one']);
    expect(await d.button('Confirm')).toBeTruthy();
    d.http.verify();
  });

  it('when a code is required by an administrator, then it cannot be switched off here', async () => {
    const d = await mount({ enrolled: true, required: true });
    expect(d.text()).toContain('An administrator requires it for your signatures.');
    expect(await d.loader.getAllHarnesses(MatButtonHarness.with({ text: 'Switch off' }))).toEqual([]);
  });

  it('when the person switches it off with the password, then the password is sent and the set-up is offered again', async () => {
    const d = await mount({ enrolled: true, required: false });
    expect(await (await d.button('Switch off')).isDisabled()).toBe(true);
    await (
      await d.loader.getHarness(MatInputHarness.with({ selector: '[type="password"]' }))
    ).setValue('correct horse battery staple');
    await (await d.button('Switch off')).click();
    const req = d.http.expectOne({ method: 'POST', url: `${STATUS_URL}/disable` });
    expect(req.request.body).toEqual({ password: 'correct horse battery staple' });
    req.flush({ enrolled: false, required: false });
    await d.settle();

    expect(await d.button('Set up')).toBeTruthy();
    d.http.verify();
  });
});
