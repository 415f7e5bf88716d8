import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { dialogProviders, mountComponent } from '../../../../../test/support/client-harness';
import { ReasonDialog, type ReasonDialogData } from './reason-dialog';

const RETURN: ReasonDialogData = {
  title: 'Return for rework',
  label: 'Reason',
  hint: 'Goes on record',
  action: 'Return',
};
const NEW_REVISION: ReasonDialogData = {
  title: 'New revision',
  label: 'Reason for change',
  hint: 'Goes on record',
  action: 'Start revision',
  choice: { label: 'Carry the attachments over', hint: 'They stay linked to the earlier revision too' },
};

async function open(data: ReasonDialogData) {
  const dialog = dialogProviders(data);
  const d = await mountComponent(ReasonDialog, { providers: dialog.providers });
  return {
    ...d,
    closed: dialog.closed,
    submit: async () => (await d.loader.getHarness(MatButtonHarness.with({ text: data.action }))).click(),
  };
}

describe('the reason dialog', () => {
  it('when the reason is shorter than 5 characters, then the dialog stays open and says why', async () => {
    const d = await open(RETURN);
    await (await d.loader.getHarness(MatInputHarness)).setValue('no');
    await d.submit();
    await d.settle();

    expect(d.closed).toEqual([]);
    expect(await (await d.loader.getHarness(MatFormFieldHarness)).getTextErrors()).toEqual([
      'Say why, in at least 5 characters',
    ]);
  });

  it('when a reason is given, then the dialog closes with it trimmed and no choice', async () => {
    const d = await open(RETURN);
    expect(await d.loader.getAllHarnesses(MatCheckboxHarness)).toEqual([]);
    await (await d.loader.getHarness(MatInputHarness)).setValue('  Cite the Kts chart  ');
    await d.submit();

    expect(d.closed).toEqual([{ reason: 'Cite the Kts chart', choice: false }]);
  });

  it('when the dialog offers a choice and it is ticked, then the answer carries it', async () => {
    const d = await open(NEW_REVISION);
    expect(d.text()).toContain('They stay linked to the earlier revision too');
    await (await d.loader.getHarness(MatInputHarness)).setValue('New coupling from the supplier');
    await (await d.loader.getHarness(MatCheckboxHarness.with({ label: 'Carry the attachments over' }))).check();
    await d.submit();

    expect(d.closed).toEqual([{ reason: 'New coupling from the supplier', choice: true }]);
  });
});
