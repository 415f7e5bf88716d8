import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import type { MailPreferenceDto } from '../../../../shared/schemas/mail.schema';
import { mountComponent, refusal } from '../../../../test/support/client-harness';
import { MailPreferences } from './mail-preferences';

const PREFS = [
  {
    event: 'impact',
    label: 'A design standard is published',
    description: 'For compliance',
    enabled: true,
    appliesToYou: false,
  },
  {
    event: 'submitted',
    label: 'A calc waits for my check',
    description: 'When an author submits',
    enabled: true,
    appliesToYou: true,
  },
] as unknown as MailPreferenceDto[];
const URL = '/api/mail/preferences';

async function mount() {
  const d = await mountComponent(MailPreferences);
  d.http.expectOne({ method: 'GET', url: URL }).flush(PREFS);
  await d.settle();
  return { ...d, toggles: () => d.loader.getAllHarnesses(MatSlideToggleHarness) };
}

describe('e-mail preferences', () => {
  it("when some events are not for the person's roles, then those are listed last and marked", async () => {
    const d = await mount();
    const labels = await Promise.all((await d.toggles()).map((t) => t.getLabelText()));
    expect(labels).toEqual(['A calc waits for my check', 'A design standard is published']);
    expect(d.text()).toContain('For compliance (not one of your roles)');
    d.http.verify();
  });

  it('when a toggle is switched off, then the change is sent and the stored list is shown', async () => {
    const d = await mount();
    const [mine] = await d.toggles();
    await mine.toggle();
    const req = d.http.expectOne({ method: 'PUT', url: URL });
    expect(req.request.body).toEqual({ preferences: { submitted: false } });
    req.flush(PREFS.map((p) => (p.event === 'submitted' ? { ...p, enabled: false } : p)));
    await d.settle();

    expect(await (await d.toggles())[0].isChecked()).toBe(false);
    expect(d.alerts()).toEqual([]);
    d.http.verify();
  });

  it('when the server refuses the change, then its reason shows and the switch shows what is stored', async () => {
    const d = await mount();
    await (await d.toggles())[0].toggle();
    d.http.expectOne({ method: 'PUT', url: URL }).flush(...refusal(403, 'You cannot change these preferences'));
    await d.settle();

    expect(d.alerts()).toEqual(['You cannot change these preferences']);
    d.http.expectOne({ method: 'GET', url: URL }).flush(PREFS);
    await d.settle();
    // Stored: still on. The switch the person moved is back where the server keeps it.
    expect(await (await d.toggles())[0].isChecked()).toBe(true);
    d.http.verify();
  });

  it('when the server refuses and the list read again differs, then the switch shows the stored value', async () => {
    const d = await mount();
    await (await d.toggles())[0].toggle();
    d.http.expectOne({ method: 'PUT', url: URL }).flush(...refusal(409, 'Changed elsewhere'));
    await d.settle();
    d.http
      .expectOne({ method: 'GET', url: URL })
      .flush(PREFS.map((p) => (p.event === 'submitted' ? { ...p, enabled: false } : p)));
    await d.settle();

    expect(await (await d.toggles())[0].isChecked()).toBe(false);
    d.http.verify();
  });
});
