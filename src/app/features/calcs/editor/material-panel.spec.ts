import { FormControl, FormGroup } from '@angular/forms';
import { MatSelectHarness } from '@angular/material/select/testing';
import { mountComponent } from '../../../../../test/support/client-harness';
import type { MaterialForm } from './editor-form';
import { MaterialPanel } from './material-panel';

const text = (v = '') => new FormControl(v, { nonNullable: true });

function emptyGroup(): FormGroup<MaterialForm> {
  return new FormGroup({
    libraryId: text(),
    name: text(),
    kind: new FormControl('steel', { nonNullable: true }),
    E: text(),
    G: text(),
    nu: text(),
    Sy: text(),
    Su: text(),
    source: text(),
    density: text(),
  } as unknown as MaterialForm);
}

async function mount() {
  const group = emptyGroup();
  const d = await mountComponent(MaterialPanel, {
    inputs: { group, value: group.getRawValue(), units: 'SI', issues: { 'material.Sy': 'Sy must be positive' } },
  });
  /** The editor passes the form's value back in on every change; the spec does the same. */
  const follow = async () => {
    d.fixture.componentRef.setInput('value', group.getRawValue());
    await d.settle();
  };
  const provenance = () =>
    [...d.element.querySelectorAll('table.provenance tr')].map((tr) => ({
      label: tr.querySelector('th')?.textContent?.trim(),
      origin: tr.querySelector('td')?.textContent?.trim(),
      changed: tr.classList.contains('changed'),
    }));
  return { ...d, group, follow, provenance };
}

describe('the material panel', () => {
  it('when a library material is picked, then its sourced values fill the form', async () => {
    const d = await mount();
    const library = await d.loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="libraryId"]' }));
    await library.open();
    await library.clickOptions({ text: 'AISI 1045 CD' });
    await d.follow();

    expect(d.group.getRawValue()).toEqual(
      expect.objectContaining({ libraryId: 'aisi-1045-cd', name: 'AISI 1045 CD', Sy: '530', Su: '630', kind: 'steel' }),
    );
    expect(d.group.controls.source.value).not.toBe('');
    expect(d.provenance().every((p) => !p.changed)).toBe(true);
  });

  it('when the author changes a library value, then that value is marked as entered, with the library value beside it', async () => {
    const d = await mount();
    const library = await d.loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="libraryId"]' }));
    await library.open();
    await library.clickOptions({ text: 'AISI 1045 CD' });
    d.group.controls.Sy.setValue('500');
    await d.follow();

    const sy = d.provenance().find((p) => p.label === 'Sy');
    expect(sy).toEqual(expect.objectContaining({ changed: true }));
    expect(sy!.origin).toMatch(/^entered by the author \(library: 530 MPa, /);
  });
});
