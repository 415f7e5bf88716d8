import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { FindingDto } from '../../../../../shared/schemas/calc-dto';
import {
  configureEditorTestBed,
  openEditor,
  storedRevision,
  TWO_STEP_SHAFT,
} from '../../../../../test/support/editor-harness';
import { PANEL_PACING } from './panel-pacer';

// A shaft on two bearings with a torque, a force and fatigue settings: fields in panels built after the first render.
const INPUT = {
  ...TWO_STEP_SHAFT,
  supports: [
    { at: 20, kind: 'deep-groove-ball', label: 'drive end' },
    { at: 380, kind: 'cylindrical-roller', label: 'free end' },
  ],
  torques: [
    { at: 50, T: 1500 },
    { at: 350, T: -1500 },
  ],
  loads: [{ label: 'belt pull', at: 200, Fy: 2000 }],
  features: [],
  bending: [],
  fatigue: { surface: 'machined', reliability: 99 },
  notes: 'keep the bearing seats ground',
};

const finding: FindingDto = {
  id: 31,
  clauseRef: null,
  anchorPath: 'supports[1].at',
  text: 'The free-end bearing sits 10 mm further out on the drawing',
  status: 'open',
  raisedBy: { id: 2, name: 'Idris Penhallow' },
  createdAt: '2026-12-01T11:00:00Z',
  answer: null,
  answeredBy: null,
  answeredAt: null,
  closedBy: null,
  closedAt: null,
};

beforeEach(() => {
  configureEditorTestBed();
  // Held: the panels below the segments wait to be scrolled to (jsdom never scrolls) or asked for.
  TestBed.overrideProvider(PANEL_PACING, { useValue: 'hold' });
});

describe('panels built after the first render', () => {
  it('when a panel is not built yet, then saving still sends its fields, and its finding shows once it is', async () => {
    const stored = storedRevision(INPUT, { status: 'returned', findings: [finding] });
    const { fixture, http, loader, settle } = await openEditor(stored, { hold: true });
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelector('[data-path="segments[0].od"]')).not.toBeNull();
    expect(root.querySelector('[data-path="supports[1].at"]')).toBeNull();
    expect(root.querySelector('tt-panel-placeholder[aria-label="Bearings"]')).not.toBeNull();
    expect(root.querySelector('[data-finding="31"]')).toBeNull();

    const label = await loader.getHarness(MatInputHarness.with({ selector: '[data-path="segments[0].label"]' }));
    await label.setValue('drive coupling seat');
    await settle();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save revision/ }))).click();
    const put = http.expectOne({ method: 'PUT', url: '/api/revisions/7' });
    const sent = put.request.body.input;
    expect(sent.segments[0].label).toBe('drive coupling seat');
    expect(sent.supports).toEqual([
      expect.objectContaining({ at: 20, kind: 'deep-groove-ball', label: 'drive end' }),
      expect.objectContaining({ at: 380, kind: 'cylindrical-roller', label: 'free end' }),
    ]);
    expect(sent.torques).toEqual([expect.objectContaining({ at: 50, T: 1500 }), expect.objectContaining({ T: -1500 })]);
    expect(sent.loads).toEqual([expect.objectContaining({ label: 'belt pull', at: 200, Fy: 2000 })]);
    expect(sent.fatigue).toEqual(expect.objectContaining({ surface: 'machined', reliability: 99 }));
    expect(sent.notes).toBe('keep the bearing seats ground');
    put.flush({ ...stored, lockVersion: 1, input: sent });
    await settle();

    // Reached by keyboard, the placeholder builds the panels and hands focus to the panel's first field.
    (root.querySelector('tt-panel-placeholder[aria-label="Bearings"]') as HTMLElement).focus();
    for (let i = 0; i < 20 && !root.querySelector('[data-finding="31"]'); i++) await settle();
    const at = root.querySelector('[data-path="supports[1].at"]')!;
    const note = at.closest('mat-form-field')!.nextElementSibling as HTMLElement;
    expect(note.getAttribute('data-finding')).toBe('31');
    expect(note.textContent).toBe('F31 open: The free-end bearing sits 10 mm further out on the drawing');
    expect(document.activeElement?.closest('tt-supports-panel')).not.toBeNull();
    expect(root.querySelector('tt-panel-placeholder')).toBeNull();
    http.verify();
  });

  it('when an input issue names a field of a panel not built yet, then its link builds the panel and goes to the field', async () => {
    const broken = { ...INPUT, torques: [{ at: 50, T: 1500 }, { at: 350 }] };
    const { fixture, settle } = await openEditor(storedRevision(broken), { hold: true });
    const root = fixture.nativeElement as HTMLElement;
    // jsdom lays nothing out, so it has no scrolling to do.
    const scrolled = jest.fn();
    Element.prototype.scrollIntoView = scrolled;
    expect(root.querySelector('[data-path="torques[1].T"]')).toBeNull();
    const link = Array.from(root.querySelectorAll<HTMLButtonElement>('.issues button.link')).find(
      (b) => b.title === 'torques[1].T',
    )!;
    link.click();
    for (let i = 0; i < 20 && document.activeElement?.getAttribute('data-path') !== 'torques[1].T'; i++) await settle();
    expect(document.activeElement?.getAttribute('data-path')).toBe('torques[1].T');
    expect(scrolled).toHaveBeenCalled();
  });
});
