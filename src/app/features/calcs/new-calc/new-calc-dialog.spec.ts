import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { dialogProviders, mountComponent, refusal } from '../../../../../test/support/client-harness';
import { NewCalcDialog } from './new-calc-dialog';

const PROJECT = { id: 4, code: 'KFD-SP450', name: 'Spiral conveyor 450' };
const RULE_SETS = [
  { id: 2, code: 'KFD-ENG-014', version: 3, title: 'Shaft design', status: 'superseded' },
  { id: 5, code: 'KFD-ENG-014', version: 4, title: 'Shaft design', status: 'effective' },
  { id: 6, code: 'KFD-ENG-014', version: 5, title: 'Shaft design', status: 'draft' },
];

async function open() {
  const dialog = dialogProviders(PROJECT);
  const d = await mountComponent(NewCalcDialog, { providers: dialog.providers });
  d.http.expectOne({ method: 'GET', url: '/api/rule-sets' }).flush(RULE_SETS);
  await d.settle();
  const input = (name: string) =>
    d.loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
  const create = async () => (await d.loader.getHarness(MatButtonHarness.with({ text: 'Create and open' }))).click();
  /** A number and title, and the standard in effect chosen. */
  const fillIn = async (number: string, title: string) => {
    await (await input('number')).setValue(number);
    await (await input('title')).setValue(title);
    const select = await d.loader.getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: /v4/ });
  };
  return { ...d, closed: dialog.closed, input, create, fillIn };
}

describe('the new calc dialog', () => {
  it('when the standard list opens, then only the version in effect can be chosen', async () => {
    const d = await open();
    const select = await d.loader.getHarness(MatSelectHarness);
    await select.open();
    const options = await select.getOptions();
    expect(await Promise.all(options.map((o) => o.getText()))).toEqual(['KFD-ENG-014 v4 — Shaft design']);
  });

  it('when no standard is chosen, then nothing is sent and the field asks for one', async () => {
    const d = await open();
    await (await d.input('number')).setValue('CV-SH-001');
    await (await d.input('title')).setValue('Head shaft');
    await d.create();
    await d.settle();

    d.http.expectNone('/api/calcs');
    const field = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /Design standard/ }));
    expect(await field.getTextErrors()).toEqual(['Choose the standard to check against']);
  });

  it('when a US-units calc is created, then the starter input is in US units and the dialog hands back where to open', async () => {
    const d = await open();
    await d.fillIn('CV-SH-002', 'Tail shaft');
    await (await d.loader.getHarness(MatButtonToggleHarness.with({ text: /^US/ }))).check();
    await d.create();

    const req = d.http.expectOne({ method: 'POST', url: '/api/calcs' });
    expect(req.request.body).toEqual(
      expect.objectContaining({ number: 'CV-SH-002', title: 'Tail shaft', ruleSetId: 5, projectId: 4 }),
    );
    expect(JSON.stringify(req.request.body.input)).toMatch(/"US"/);
    req.flush({ id: 31, latest: { id: 77 } });
    await d.settle();
    expect(d.closed).toEqual([{ calcId: 31, revisionId: 77 }]);
  });

  it("when the number is taken in the project, then the server's reason shows under the number", async () => {
    const d = await open();
    await d.fillIn('CV-SH-001', 'Head shaft');
    await d.create();
    d.http
      .expectOne('/api/calcs')
      .flush(...refusal(409, 'Conflict', { number: ['CV-SH-001 is already used in KFD-SP450'] }));
    await d.settle();

    const field = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /Calc number/ }));
    expect(await field.getTextErrors()).toEqual(['CV-SH-001 is already used in KFD-SP450']);
    expect(d.closed).toEqual([]);
  });
});
