import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../shared/authz/app-ability';
import type { RevisionDto } from '../../shared/schemas/calc-dto';
import ruleSetDocument from '../../rules/kfd-eng-014-v3.json';
import RevisionEditor from '../../src/app/features/calcs/editor/revision-editor';
import { EDITOR_DEBOUNCE_MS } from '../../src/app/features/calcs/editor/editor-support';

/*
 * The calc editor under jest with its three reads answered (revision, standard, calc heading) and
 * live results without debounce, for component specs that drive it through Material harnesses.
 */
/** An invented two-step shaft in AISI 1045 CD (the editor specs add their loads and features to it). */
export const TWO_STEP_SHAFT = {
  units: 'SI',
  material: { name: 'AISI 1045 CD', kind: 'steel', E: 207, G: 79.3, Sy: 530, Su: 630, nu: 0.292 },
  segments: [
    { label: 'coupling seat', length: 100, od: 60, id: 0 },
    { label: 'body', length: 300, od: 70, id: 0 },
  ],
};

export const EDITOR_AUTHOR = { id: 1, roles: ['author'] as const };

export function storedRevision(input: unknown, over: Partial<RevisionDto> = {}): RevisionDto {
  return {
    id: 7,
    calcId: 3,
    seq: 0,
    label: 'A',
    status: 'draft',
    verdict: null,
    author: { id: EDITOR_AUTHOR.id, name: 'Morwenna Hale' },
    checker: null,
    approver: null,
    ruleSet: { id: 2, code: 'KFD-ENG-014', version: 3, title: 'Shaft design' },
    reasonForChange: 'first issue',
    updatedAt: '2026-12-01T10:00:00Z',
    approvedAt: null,
    lockVersion: 0,
    input: JSON.parse(JSON.stringify(input)),
    result: null,
    checklist: null,
    inputIssues: [],
    manualItems: {},
    contentHash: null,
    contentFormat: 2,
    signatures: [],
    findings: [],
    submittedAt: null,
    checkedAt: null,
    createdAt: '2026-12-01T09:00:00Z',
    editorIds: [EDITOR_AUTHOR.id],
    ...over,
  };
}

export function configureEditorTestBed(): void {
  localStorage.clear();
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideRouter([]),
      {
        provide: PureAbility,
        useValue: createAppAbility(defineRulesFor({ id: EDITOR_AUTHOR.id, roles: [...EDITOR_AUTHOR.roles] })),
      },
      { provide: EDITOR_DEBOUNCE_MS, useValue: 0 },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
    ],
  });
}

/**
 * Opens the editor on `stored`; `settle()` lets effects and promises run, then waits until stable. The panels
 * below the segments are built in turn after the first render (PanelPacer): it waits for them unless `hold`, which
 * a spec gives with PANEL_PACING 'hold' to see the editor before they are built.
 */
export async function openEditor(stored: RevisionDto, opts: { hold?: boolean } = {}) {
  const fixture: ComponentFixture<RevisionEditor> = TestBed.createComponent(RevisionEditor);
  fixture.componentRef.setInput('id', stored.id);
  const http = TestBed.inject(HttpTestingController);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const turn = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    fixture.detectChanges();
  };
  const settle = async () => {
    await turn();
    await fixture.whenStable();
  };
  fixture.detectChanges();
  http.expectOne(`/api/revisions/${stored.id}`).flush(stored);
  await turn();
  http.expectOne(`/api/rule-sets/${stored.ruleSet.id}`).flush({ document: ruleSetDocument });
  await turn();
  http.expectOne(`/api/calcs/${stored.calcId}`).flush({ number: 'CV-7', title: 'Countershaft' });
  await settle();
  if (!opts.hold) await panelsBuilt(fixture.nativeElement as HTMLElement, settle);
  return { fixture, http, loader, settle };
}

/** Settles until no panel of the editor waits to be built (each is built in its own turn). */
export async function panelsBuilt(root: HTMLElement, settle: () => Promise<void>): Promise<void> {
  for (let turns = 0; turns < 40 && root.querySelector('tt-panel-placeholder, .plots-wait'); turns++) await settle();
  await settle();
}
