import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { RuleSetDto } from '../../../../shared/schemas/rule-set.schema';
import { PureAbility } from '@casl/ability';
import { createAppAbility } from '../../../../shared/authz/app-ability';
import { SessionStore } from '../../core/auth/session-store';
import { mountComponent, refusal } from '../../../../test/support/client-harness';
import { PublishPanel } from './publish-panel';

const DRAFT = {
  id: 9,
  code: 'KFD-ENG-014',
  version: 5,
  lockVersion: 2,
  proposedBy: null,
  confirmedBy: null,
  effectiveDate: null,
} as unknown as RuleSetDto;
const PROPOSED = { ...DRAFT, proposedBy: 'Ffion Treharne', effectiveDate: '2027-01-01', lockVersion: 3 } as RuleSetDto;

/** The panel as `displayName` sees it: the session is read through the API as the app does. */
async function mount(version: RuleSetDto, displayName: string) {
  const ability = { provide: PureAbility, useValue: createAppAbility([]) };
  const d = await mountComponent(PublishPanel, { inputs: { version }, providers: [ability] });
  const load = TestBed.inject(SessionStore).load();
  d.http
    .expectOne('/api/session')
    .flush({ user: { id: 4, username: 'c', displayName, roles: ['compliance'] }, rules: [], csrfToken: 't' });
  await load;
  await d.settle();
  const changes: unknown[] = [];
  d.fixture.componentInstance.changed.subscribe(() => changes.push(true));
  const button = (text: string | RegExp) => d.loader.getHarness(MatButtonHarness.with({ text }));
  return { ...d, changes, button };
}

describe('publishing a design standard version', () => {
  it('when a draft is proposed with a date, then the date and stored version are sent and the page is told to reload', async () => {
    const d = await mount(DRAFT, 'Ffion Treharne');
    expect(await (await d.button('Propose')).isDisabled()).toBe(true);
    await (await d.loader.getHarness(MatInputHarness.with({ selector: '[type="date"]' }))).setValue('2027-01-01');
    await (await d.button('Propose')).click();
    const req = d.http.expectOne({ method: 'POST', url: '/api/rule-sets/9/propose' });
    expect(req.request.body).toEqual({ effectiveDate: '2027-01-01', lockVersion: 2 });
    req.flush(PROPOSED);
    await d.settle();

    expect(d.changes).toHaveLength(1);
    d.http.verify();
  });

  it('when the proposer looks at their own proposal, then they cannot confirm it', async () => {
    const d = await mount(PROPOSED, 'Ffion Treharne');
    expect(d.text()).toContain('You proposed this version, so someone else in compliance must confirm it.');
    expect(await d.loader.getAllHarnesses(MatButtonHarness.with({ text: /Confirm/ }))).toEqual([]);
  });

  it('when a second person confirms with a wrong password, then the reason shows and nothing is reported as changed', async () => {
    const d = await mount(PROPOSED, 'Osian Pryce');
    await (
      await d.loader.getHarness(MatInputHarness.with({ selector: '[type="password"]' }))
    ).setValue('not my password');
    await (await d.button(/Confirm and make effective/)).click();
    const req = d.http.expectOne({ method: 'POST', url: '/api/rule-sets/9/confirm' });
    expect(req.request.body).toEqual({ password: 'not my password', lockVersion: 3 });
    req.flush(...refusal(403, 'Your password does not match'));
    await d.settle();

    expect(d.alerts()).toEqual([expect.stringContaining('Your password does not match')]);
    expect(d.changes).toEqual([]);
    d.http.verify();
  });
});
