import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { PureAbility } from '@casl/ability';
import { createAppAbility } from '../../../../../shared/authz/app-ability';
import type { CalcDto } from '../../../../../shared/schemas/calc-dto';
import { SessionStore } from '../../../core/auth/session-store';
import { EDITOR_AUTHOR, TWO_STEP_SHAFT, storedRevision } from '../../../../../test/support/editor-harness';
import CalcPage from './calc-page';

// A draft with a result: its author is offered the signature that submits it.
const REVISION = storedRevision(TWO_STEP_SHAFT, { result: {} });
const CALC: CalcDto = {
  id: 3,
  projectId: 1,
  projectCode: 'KF-0001',
  projectName: 'Kestrel Fen conveyor drives',
  projectArchived: false,
  number: 'CV-12',
  title: 'Head pulley shaft',
  partRef: 'KF-0001-204',
  createdAt: '2026-12-01T09:00:00Z',
  latest: REVISION,
  revisions: [REVISION],
};
const AUTHOR = {
  ...EDITOR_AUTHOR,
  roles: [...EDITOR_AUTHOR.roles],
  username: 'mhale',
  displayName: 'M Hale',
  email: '',
};

async function open() {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: PureAbility, useValue: createAppAbility([]) },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
    ],
  });
  const http = TestBed.inject(HttpTestingController);
  const signedIn = TestBed.inject(SessionStore).load();
  http.expectOne('/api/session').flush({ user: AUTHOR, rules: [], csrfToken: 't' });
  await signedIn;
  const fixture = TestBed.createComponent(CalcPage);
  fixture.componentRef.setInput('id', 3);
  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    TestBed.tick();
    fixture.detectChanges();
  };
  await settle();
  http.expectOne('/api/calcs/3').flush(CALC);
  http.expectOne('/api/calcs/3/latest-revision').flush(REVISION);
  await settle();
  const element = fixture.nativeElement as HTMLElement;
  const actions = () => element.querySelector('.actions') as HTMLElement;
  const next = () => element.querySelector('.next[role="status"]') as HTMLElement;
  const buttons = () => [...actions().querySelectorAll('button')] as HTMLButtonElement[];
  return { fixture, http, settle, actions, next, buttons };
}

describe('the calc page while its revision is read again', () => {
  it('when an attachment change makes the page re-read the revision, then the workflow actions wait for it', async () => {
    const d = await open();
    expect(d.buttons().map((b) => b.textContent?.trim())).toContain('send Sign and submit for check');
    expect(d.buttons().every((b) => !b.disabled)).toBe(true);

    // What the attachments panel's (changed) output does: read the revision again (its hash now covers the file).
    (d.fixture.componentInstance as unknown as { revision: { reload(): void } }).revision.reload();
    await d.settle();

    expect(d.buttons().every((b) => b.disabled)).toBe(true);
    expect(d.actions().getAttribute('aria-busy')).toBe('true');
    expect(d.next().textContent).toContain('Updating the revision…');

    d.http.expectOne('/api/calcs/3/latest-revision').flush({ ...REVISION, contentHash: 'f'.repeat(64) });
    await d.settle();

    expect(d.buttons().every((b) => !b.disabled)).toBe(true);
    expect(d.actions().getAttribute('aria-busy')).toBe('false');
    expect(d.next().textContent).not.toContain('Updating');
  });
});
