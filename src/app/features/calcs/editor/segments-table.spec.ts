import { FormArray, type FormGroup } from '@angular/forms';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { mountComponent } from '../../../../../test/support/client-harness';
import { segmentGroup, type SegmentForm } from './row-forms';
import { takeOverRowKeys } from './row-keys';
import { SegmentsTable } from './segments-table';

function rows() {
  return new FormArray<FormGroup<SegmentForm>>([
    segmentGroup({ label: 'journal', length: '40', od: '45' }),
    segmentGroup({ label: 'hub seat', length: '80', od: '50', id: '12' }),
  ]);
}

async function mount(issues: Record<string, string> = {}, canEdit = true) {
  const array = rows();
  const d = await mountComponent(SegmentsTable, { inputs: { rows: array, units: 'SI', issues, canEdit } });
  const button = (label: string) => d.loader.getHarness(MatButtonHarness.with({ selector: `[aria-label="${label}"]` }));
  const labels = () => array.controls.map((c) => c.controls.label.value);
  return { ...d, array, button, labels };
}

describe('the segments table', () => {
  it("when a segment is added, then it starts with the last segment's diameters and an empty length", async () => {
    const d = await mount();
    await (await d.loader.getHarness(MatButtonHarness.with({ text: /Add segment/ }))).click();
    await d.settle();

    expect(d.array.length).toBe(3);
    expect(d.array.at(2).getRawValue()).toEqual(expect.objectContaining({ od: '50', id: '12', length: '' }));
    const inputs = await d.loader.getAllHarnesses(
      MatInputHarness.with({ selector: '[aria-label="Segment 3 outer diameter in mm"]' }),
    );
    expect(await inputs[0].getValue()).toBe('50');
  });

  it('when segments are moved and removed, then the form array follows, and the ends cannot move past the shaft', async () => {
    const d = await mount();
    expect(await (await d.button('Move segment 1 left')).isDisabled()).toBe(true);
    expect(await (await d.button('Move segment 2 right')).isDisabled()).toBe(true);
    await (await d.button('Move segment 2 left')).click();
    await d.settle();
    expect(d.labels()).toEqual(['hub seat', 'journal']);
    await (await d.button('Remove segment 1')).click();
    await d.settle();
    expect(d.labels()).toEqual(['journal']);
  });

  it('when the form is replaced (load, restore, unit change), then its rows take over the rows on screen', async () => {
    const d = await mount();
    const rowsShown = () => Array.from(d.element.querySelectorAll('tbody tr'));
    /** The very elements (toEqual would accept look-alikes built again). */
    const isShowing = (expected: Element[]) =>
      rowsShown().length === expected.length && rowsShown().every((row, i) => row === expected[i]);
    const shown = rowsShown();
    const fresh = new FormArray([
      segmentGroup({ label: 'journal', length: '1.575', od: '1.772' }),
      segmentGroup({ label: 'hub seat', length: '3.150', od: '1.969', id: '0.472' }),
    ]);
    takeOverRowKeys(d.array, fresh);
    d.fixture.componentRef.setInput('rows', fresh);
    d.fixture.componentRef.setInput('units', 'US');
    await d.settle();

    expect(isShowing(shown)).toBe(true);
    const length = await d.loader.getHarness(
      MatInputHarness.with({ selector: '[aria-label="Segment 2 length in in"]' }),
    );
    expect(await length.getValue()).toBe('3.150');
    await (await d.button('Move segment 2 left')).click();
    await d.settle();
    expect(fresh.controls.map((c) => c.controls.label.value)).toEqual(['hub seat', 'journal']);
    expect(isShowing([shown[1], shown[0]])).toBe(true); // a row moves whole, as before
  });

  it('when the live calc reports issues, then each shows under its row with the field named', async () => {
    const d = await mount({
      'segments[1].id': 'inner diameter 12 mm must be smaller than outer diameter',
      'segments[0]': 'too short',
    });
    const issueRows = [...d.element.querySelectorAll('tr.row-issue')].map((r) =>
      r.textContent?.replace(/\s+/g, ' ').trim(),
    );
    expect(issueRows).toEqual([
      'Segment: too short',
      'Inner ⌀: inner diameter 12 mm must be smaller than outer diameter',
    ]);
  });

  it('when the revision is read-only, then there is nothing to add, move or remove', async () => {
    const d = await mount({}, false);
    expect(await d.loader.getAllHarnesses(MatButtonHarness)).toEqual([]);
  });
});
