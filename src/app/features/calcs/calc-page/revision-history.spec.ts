import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { mountComponent, refusal } from '../../../../../test/support/client-harness';
import { RevisionHistory } from './revision-history';

const REVISIONS = [
  { id: 11, label: 'A' },
  { id: 12, label: 'B' },
  { id: 13, label: 'C' },
];

async function mount() {
  const d = await mountComponent(RevisionHistory, { inputs: { calcId: 3, revisions: REVISIONS, selectedId: 13 } });
  const compare = () => d.loader.getHarness(MatButtonHarness.with({ text: 'Compare' }));
  /** Picks the pair in the two selects and asks for the comparison. */
  const compareRevisions = async (fromLabel: string, toLabel: string) => {
    const [from, to] = await d.loader.getAllHarnesses(MatSelectHarness);
    await from.open();
    await from.clickOptions({ text: `rev ${fromLabel}` });
    await to.open();
    await to.clickOptions({ text: `rev ${toLabel}` });
    await (await compare()).click();
  };
  return { ...d, compare, compareRevisions };
}

describe('comparing two revisions', () => {
  it('when no pair is chosen, then Compare is off', async () => {
    const d = await mount();
    expect(await (await d.compare()).isDisabled()).toBe(true);
  });

  it('when two revisions are compared, then both diffs show, and a side without changes says so', async () => {
    const d = await mount();
    await d.compareRevisions('A', 'C');
    const req = d.http.expectOne((r) => r.url.startsWith('/api/calcs/3/diff'));
    expect(req.request.urlWithParams).toBe('/api/calcs/3/diff?from=11&to=13');
    req.flush({ input: '-  "od": 45\n+  "od": 50', checklist: null });
    await d.settle();

    const blocks = [...d.element.querySelectorAll('pre.diff')].map((p) => p.textContent);
    expect(blocks).toEqual(['-  "od": 45\n+  "od": 50', 'No differences in the checklist outcomes.']);
    d.http.verify();
  });

  it('when the server refuses the comparison, then its reason shows', async () => {
    const d = await mount();
    await d.compareRevisions('B', 'C');
    d.http.expectOne((r) => r.url.startsWith('/api/calcs/3/diff')).flush(...refusal(404, 'Revision not found'));
    await d.settle();

    expect(d.alerts()).toEqual(['Revision not found']);
    d.http.verify();
  });
});
