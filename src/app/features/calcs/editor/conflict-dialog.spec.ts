import { MatButtonHarness } from '@angular/material/button/testing';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { dialogProviders, mountComponent } from '../../../../../test/support/client-harness';
import { ConflictDialog, type ConflictData } from './conflict-dialog';

const STORED_INPUT = {
  title: 'Head shaft',
  segments: [
    { length: 120, od: 45 },
    { length: 80, od: 40 },
  ],
};
const THEIRS = {
  id: 7,
  label: 'B',
  lockVersion: 5,
  updatedAt: '2026-12-01T10:30:00Z',
  input: STORED_INPUT,
} as unknown as RevisionDto;

async function open(mine: Record<string, unknown>) {
  const dialog = dialogProviders<ConflictData>({ mine, myBase: 4, theirs: THEIRS });
  const d = await mountComponent(ConflictDialog, { providers: dialog.providers });
  const rows = () =>
    [...d.element.querySelectorAll('table.compare tbody tr')].map((tr) =>
      [...tr.querySelectorAll('.place, td')].map((c) => c.textContent?.trim()),
    );
  const choose = async (text: RegExp) => (await d.loader.getHarness(MatButtonHarness.with({ text }))).click();
  return { ...d, closed: dialog.closed, rows, choose };
}

describe('the save-conflict dialog', () => {
  it('when both sides changed a segment, then each differing field is listed with its place, mine beside theirs', async () => {
    const d = await open({
      title: 'Head shaft',
      segments: [
        { length: 120, od: 50 },
        { length: 80, od: 40 },
        { length: 30, od: 35 },
      ],
    });

    expect(d.text()).toContain('You started from version 4. Revision B as stored is now at version 5');
    expect(d.rows()).toEqual([
      ['Segment 1, outer ⌀', '50', '45'],
      ['Segment 3, length', '30', '—'],
      ['Segment 3, outer ⌀', '35', '—'],
    ]);
  });

  it('when the inputs are the same, then the dialog says only the version moved on', async () => {
    const d = await open(JSON.parse(JSON.stringify(STORED_INPUT)));
    expect(d.rows()).toEqual([]);
    expect(d.text()).toContain('The inputs are the same');
  });

  it.each([
    [/Keep mine/, 'keep-mine'],
    [/Take theirs/, 'take-theirs'],
    [/Decide later/, undefined],
  ])('when the author picks %s, then the dialog closes with that choice', async (button, choice) => {
    const d = await open({ ...STORED_INPUT, title: 'Head shaft, longer hub' });
    await d.choose(button);
    expect(d.closed).toEqual([choice]);
  });
});
