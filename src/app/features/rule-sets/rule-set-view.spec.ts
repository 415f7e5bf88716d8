import { PureAbility } from '@casl/ability';
import { provideRouter } from '@angular/router';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import type { RuleSetDto } from '../../../../shared/schemas/rule-set.schema';
import { createAppAbility } from '../../../../shared/authz/app-ability';
import { mountComponent } from '../../../../test/support/client-harness';
import lifting from '../../../../rules/kfd-eng-021-v2.json';
import general from '../../../../rules/kfd-eng-014-v4.json';
import RuleSetView from './rule-set-view';

const version = (document: Record<string, unknown>): RuleSetDto =>
  ({
    id: 9,
    code: document['code'],
    version: document['version'],
    title: document['title'],
    status: 'effective',
    effectiveDate: '2026-06-01',
    contentHash: 'ab'.repeat(32),
    lockVersion: 1,
    proposedBy: 'Ffion Treharne',
    confirmedBy: 'Osian Pryce',
    updatedAt: '2026-06-01T08:00:00Z',
    document,
  }) as RuleSetDto;

/** The view of one effective version, read as an author (who may read but not edit), on its methods tab. */
async function methodsTab(document: Record<string, unknown>) {
  const ability = { provide: PureAbility, useValue: createAppAbility([]) };
  const d = await mountComponent(RuleSetView, { inputs: { id: 9 }, providers: [ability, provideRouter([])] });
  d.http.expectOne('/api/rule-sets/9').flush(version(document));
  await d.settle();
  await (await d.loader.getHarness(MatTabGroupHarness)).selectTab({ label: 'Methods and manual items' });
  await d.settle();
  const section = () => {
    const list = d.element.querySelector('dl.checking');
    const terms = Array.from(list?.querySelectorAll('dt') ?? []).map((t) => t.textContent!.trim());
    const values = Array.from(list?.querySelectorAll('dd') ?? []).map((v) => v.textContent!.trim());
    return Object.fromEntries(terms.map((t, i) => [t, values[i]]));
  };
  return { ...d, section };
}

describe('the standards view: how calcs are checked', () => {
  it('when the standard asks for an independent model of every calc, then its scope, tolerances and origin show in words', async () => {
    const d = await methodsTab(lifting);
    expect(d.text()).toContain('How calcs are checked');
    expect(d.section()).toEqual({
      Checking: 'Independent model required for every calc under this standard',
      Inputs: 'Inputs equal after unit conversion when within 0.1 %',
      Results: 'Results agree when within 2 %',
      Origin: expect.stringContaining('alternate calculations'),
    });
    d.http.verify();
  });

  it('when the standard sets no independent model, then it says review alone and shows no tolerances', async () => {
    const d = await methodsTab(general);
    expect(d.section()).toEqual({
      Checking: 'Checked by review alone; no independent model required',
      Inputs: '—',
      Results: '—',
      Origin: '—',
    });
    d.http.verify();
  });

  it('when the view opens, then the calcs to try it on are read only once the Try it tab is opened', async () => {
    const d = await methodsTab(lifting);
    d.http.verify();
    // Clicked in the DOM: a harness waits for the page to settle, which the calcs request it starts holds off.
    const tab = Array.from(d.element.querySelectorAll<HTMLElement>('[role="tab"]')).find((t) =>
      /Try it/.test(t.textContent!),
    );
    tab!.click();
    await d.settle();
    d.http.expectOne((r) => r.url === '/api/calcs').flush({ items: [], next: null, total: 0, totalIsAtLeast: false });
    await d.settle();
    d.http.verify();
  });
});
