import { Router, provideRouter } from '@angular/router';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { mountComponent, refusal } from '../../../../test/support/client-harness';
import VerifyPage from './verify-page';

const HASH = 'ab'.repeat(32);
const FOUND = {
  hash: HASH,
  found: true,
  message: 'This hash belongs to a stored revision, as stored now.',
  matches: [
    {
      revisionId: 7,
      projectCode: 'KFD-SP450',
      calcNumber: 'CV-1',
      revision: 'B',
      calcTitle: 'Head shaft',
      state: 'approved',
      verdict: 'compliant',
      ruleSet: 'KFD-ENG-014 v4',
      contentIntact: true,
      match: 'current',
      signatures: [
        {
          printedName: 'Morwenna Hale',
          meaning: 'authored',
          role: 'author',
          signedAt: '2026-12-01T10:00:00Z',
          isValid: true,
          coversThisHash: true,
        },
      ],
    },
  ],
};

async function mount(hash?: string) {
  const d = await mountComponent(VerifyPage, { inputs: { hash }, providers: [provideRouter([])] });
  return d;
}

describe('the verify page', () => {
  it('when a typed hash is not 64 hexadecimal characters, then the page says so and goes nowhere', async () => {
    const d = await mount();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate');
    await (await d.loader.getHarness(MatInputHarness)).setValue('not a hash');
    await (await d.loader.getHarness(MatButtonHarness.with({ text: /Verify/ }))).click();
    await d.settle();

    expect(await (await d.loader.getHarness(MatFormFieldHarness)).getTextErrors()).toEqual([
      'Enter the 64 hexadecimal characters printed as the record hash',
    ]);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('when a printed hash is typed with spaces and capitals, then the page opens it in the plain form', async () => {
    const d = await mount();
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await d.loader.getHarness(MatInputHarness)).setValue(`${HASH.slice(0, 32).toUpperCase()} ${HASH.slice(32)}`);
    await (await d.loader.getHarness(MatButtonHarness.with({ text: /Verify/ }))).click();

    expect(navigate).toHaveBeenCalledWith(['/verify', HASH]);
  });

  it('when the hash belongs to an approved revision, then its state, content and signatures are shown', async () => {
    const d = await mount(HASH);
    d.http.expectOne(`/api/verify/${HASH}`).flush(FOUND);
    await d.settle();

    expect(d.text()).toContain('This hash belongs to a stored revision, as stored now.');
    expect(d.text()).toContain('KFD-SP450 / CV-1 rev B Head shaft');
    expect(d.text()).toContain('Content intact');
    expect(d.text()).toContain(
      'Morwenna Hale — authored (author), 2026-12-01 10:00 UTC: valid for the content now; made over this hash',
    );
    d.http.verify();
  });

  it('when the look-up fails, then the reason shows inline', async () => {
    const d = await mount(HASH);
    d.http.expectOne(`/api/verify/${HASH}`).flush(...refusal(500, 'The record store cannot be read just now'));
    await d.settle();

    const [alert] = d.alerts();
    expect(alert).toContain('The server failed to load the record for this hash');
    expect(alert).toContain('The record store cannot be read just now');
    d.http.verify();
  });
});
