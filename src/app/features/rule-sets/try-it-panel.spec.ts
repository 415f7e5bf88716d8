import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { mountComponent, refusal } from '../../../../test/support/client-harness';
import { TryItPanel } from './try-it-panel';

const CALCS = {
  items: [{ id: 3, projectCode: 'KFD-SP450', number: 'CV-1', title: 'Head shaft', latest: { id: 71, label: 'B' } }],
  next: null,
  total: 1,
  totalIsAtLeast: false,
};

async function mount() {
  const d = await mountComponent(TryItPanel, { inputs: { ruleSetId: 9 } });
  d.http.expectOne((r) => r.method === 'GET' && r.url === '/api/calcs').flush(CALCS);
  await d.settle();
  const evaluate = () => d.loader.getHarness(MatButtonHarness.with({ text: 'Evaluate' }));
  const choose = async () => {
    const select = await d.loader.getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: /CV-1 rev B/ });
  };
  return { ...d, evaluate, choose };
}

describe('trying a design standard version on a calc', () => {
  it('when no calc is chosen, then Evaluate is off', async () => {
    const d = await mount();
    expect(await (await d.evaluate()).isDisabled()).toBe(true);
    d.http.verify();
  });

  it('when a calc is evaluated, then its latest revision is sent and nothing else is requested', async () => {
    const d = await mount();
    await d.choose();
    await (await d.evaluate()).click();
    const req = d.http.expectOne({ method: 'POST', url: '/api/rule-sets/9/try' });
    expect(req.request.body).toEqual({ revisionId: 71 });
    d.http.verify();
  });

  it('when the server refuses, then its reason shows', async () => {
    const d = await mount();
    await d.choose();
    await (await d.evaluate()).click();
    d.http
      .expectOne('/api/rule-sets/9/try')
      .flush(...refusal(422, 'The revision has input errors and cannot be evaluated'));
    await d.settle();

    expect(d.alerts()).toEqual(['The revision has input errors and cannot be evaluated']);
    d.http.verify();
  });
});
