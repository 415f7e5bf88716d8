import type { FindingDto } from '../../../../../shared/schemas/calc-dto';
import {
  configureEditorTestBed,
  openEditor,
  storedRevision,
  TWO_STEP_SHAFT,
} from '../../../../../test/support/editor-harness';

// A two-step shaft, enough for the editor's panels to show their fields.
const INPUT = {
  ...TWO_STEP_SHAFT,
  torques: [
    { at: 50, T: 1500 },
    { at: 350, T: -1500 },
  ],
  features: [],
  bending: [],
};

function finding(id: number, over: Partial<FindingDto>): FindingDto {
  return {
    id,
    clauseRef: null,
    anchorPath: null,
    text: 'check this',
    status: 'open',
    raisedBy: { id: 2, name: 'Idris Penhallow' },
    createdAt: '2026-12-01T11:00:00Z',
    answer: null,
    answeredBy: null,
    answeredAt: null,
    closedBy: null,
    closedAt: null,
    ...over,
  };
}

beforeEach(() => configureEditorTestBed());

describe('findings anchored to inputs, in the editor', () => {
  it('when a finding is anchored to a field or an entry, then it shows beside that field; a clause finding does not', async () => {
    const stored = storedRevision(INPUT, {
      status: 'returned',
      findings: [
        finding(11, { anchorPath: 'segments[1].od', text: 'Bearing seat ⌀ differs from drawing DRG-1' }),
        finding(12, { anchorPath: 'material', text: 'Name the certificate', status: 'answered', answer: 'Cert 77' }),
        finding(13, { clauseRef: '4.2', anchorPath: 'segments[1]', text: 'Clause finding' }),
      ],
    });
    const { fixture, http } = await openEditor(stored);
    const root = fixture.nativeElement as HTMLElement;

    const odField = root.querySelector('[data-path="segments[1].od"]')!.closest('mat-form-field')!;
    const note = odField.nextElementSibling as HTMLElement;
    expect(note.getAttribute('role')).toBe('note');
    expect(note.textContent).toBe('F11 open: Bearing seat ⌀ differs from drawing DRG-1');
    const material = root.querySelector('[data-finding="12"]') as HTMLElement;
    expect(material.textContent).toBe('F12 answered: Name the certificate — answer: Cert 77');
    expect(material.closest('tt-material-panel')).not.toBeNull();
    expect(root.querySelector('[data-finding="13"]')).toBeNull();
    http.verify();
  });

  it('when the editor re-renders, then each note stays once beside its field', async () => {
    const stored = storedRevision(INPUT, { findings: [finding(21, { anchorPath: 'segments[0]' })] });
    const { fixture, settle, http } = await openEditor(stored);
    fixture.detectChanges();
    await settle();
    const root = fixture.nativeElement as HTMLElement;
    const notes = root.querySelectorAll('[data-finding="21"]');
    expect(notes.length).toBe(1);
    expect(notes[0].previousElementSibling!.querySelector('[data-path="segments[0].label"]')).not.toBeNull();
    http.verify();
  });
});
