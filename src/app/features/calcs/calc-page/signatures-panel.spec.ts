import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { mountComponent } from '../../../../../test/support/client-harness';
import { SignaturesPanel } from './signatures-panel';

const HASH = 'ab'.repeat(32);
function signature(
  id: number,
  meaning: string,
  isValid: boolean,
  attachments: { name: string; kind: string; sha256: string }[] | null,
) {
  return {
    id,
    meaning,
    role: meaning === 'authored' ? 'author' : 'checker',
    printedName: `Person ${id}`,
    signedAt: '2026-12-01T10:00:00Z',
    contentHash: HASH,
    isValid,
    attachments,
  };
}

async function mount(signatures: ReturnType<typeof signature>[], contentHash: string | null = HASH) {
  const d = await mountComponent(SignaturesPanel, {
    inputs: { revision: { id: 7, contentHash, signatures } as unknown as RevisionDto },
  });
  const items = () =>
    [...d.element.querySelectorAll('ul.sigs > li')].map((li) => ({
      isInvalid: li.classList.contains('invalid'),
      text: li.textContent?.replace(/\s+/g, ' ').trim() ?? '',
    }));
  return { ...d, items };
}

describe('the signatures panel', () => {
  it('when one signature still matches and one does not, then each says so and the broken one is marked', async () => {
    const d = await mount([
      signature(1, 'authored', true, [{ name: 'DRG-1.pdf', kind: 'drawing', sha256: 'cd'.repeat(32) }]),
      signature(2, 'checked', false, []),
    ]);
    const [authored, checked] = d.items();
    expect(authored.isInvalid).toBe(false);
    expect(authored.text).toContain('Person 1 — authored (author)');
    expect(authored.text).toContain('Matches the content as stored now.');
    expect(authored.text).toContain('Covered 1 attachment: DRG-1.pdf (drawing, cdcdcdcdcdcd…)');
    expect(authored.text).toContain('2026-12-01 10:00:00 UTC · hash abababababababab…');
    expect(checked.isInvalid).toBe(true);
    expect(checked.text).toContain('No longer matches: the content or the attachments changed after this signature.');
    expect(checked.text).toContain('Covered no attachments.');
  });

  it('when a signature predates signed attachments, then it says it covers none', async () => {
    const d = await mount([signature(3, 'authored', true, null)]);
    expect(d.items()[0].text).toContain('Made before attachments were part of what is signed: covers none.');
  });

  it('when nothing is signed and the input has errors, then the panel says so instead of a hash', async () => {
    const d = await mount([], null);
    expect(d.items()).toEqual([]);
    expect(d.text()).toContain('Content hash now: none (input has errors)');
    expect(d.text()).toContain('Not signed yet');
  });
});
