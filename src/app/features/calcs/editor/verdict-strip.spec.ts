import { TestBed } from '@angular/core/testing';
import type { Checklist, RuleSet } from '../../../../../shared/rules';
import type { CalcResult } from '../../../../../shared/engine';
import { VerdictStrip } from './verdict-strip';
import { ChecklistTable } from '../checklist/checklist-table';

const row = (clauseId: string, severity: string, status: string) => ({
  clauseId,
  clauseTitle: `Clause ${clauseId}`,
  severity,
  status,
  location: { label: 'segment 2' },
  actual: null,
  limit: null,
  unit: '',
  utilisation: null,
  message: 'fails',
  warnings: [],
});
const CHECKLIST = {
  verdict: 'compliant',
  ruleSet: { code: 'KFD-ENG-014', version: 3 },
  manual: [],
  rows: [row('4.1', 'mandatory', 'pass'), row('4.3', 'advisory', 'fail')],
} as unknown as Checklist;

describe('verdict and severity while editing', () => {
  it('when a compliant calc has an advisory failure, then the sticky strip says "meets" and names it as advisory, not as a failure', () => {
    const fixture = TestBed.createComponent(VerdictStrip);
    fixture.componentRef.setInput('state', {
      kind: 'ready',
      checklist: CHECKLIST,
      ruleSet: {} as RuleSet,
      result: {} as CalcResult,
    });
    fixture.detectChanges();
    const text = (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('✓ Meets KFD-ENG-014 v3');
    expect(text).toContain('1 advisory not met');
    expect(text).not.toContain('mandatory failing');
    expect(text).toContain('advisory · §4.3 Clause 4.3, segment 2');
  });

  it('when the verdict arrives, or more clauses fail, after the user aimed at the form, then the strip above it was already there: nothing under the pointer moves', () => {
    const fixture = TestBed.createComponent(VerdictStrip);
    const host = fixture.nativeElement as HTMLElement;
    const ready = (rows: ReturnType<typeof row>[]) => ({
      kind: 'ready' as const,
      checklist: { ...CHECKLIST, verdict: 'not-compliant', rows } as unknown as Checklist,
      ruleSet: {} as RuleSet,
      result: {} as CalcResult,
    });
    // Before the engine has judged anything, as the checker picks a material and starts on the segments.
    fixture.componentRef.setInput('state', { kind: 'none' });
    fixture.detectChanges();
    const box = host.querySelector('.strip');
    expect(box).not.toBeNull();
    expect(box!.textContent).toContain('No verdict yet');
    for (const state of [
      ready([row('4.1', 'mandatory', 'pass')]),
      ready(['5.1', '5.2', '5.3', '5.4', '5.5', '5.6', '5.7'].map((id) => row(id, 'mandatory', 'fail'))),
      { kind: 'failed', message: 'The checklist could not be evaluated: no rule set' },
    ]) {
      fixture.componentRef.setInput('state', state);
      fixture.detectChanges();
      // The same box, filled in place (its one height is in verdict-strip.scss; jsdom lays nothing out, the browser
      // spec test/e2e/independent-model.spec.ts measures it): the verdict never inserts a block above the form.
      expect(host.querySelector('.strip')).toBe(box);
    }
    expect(host.querySelectorAll('.rows li')).toHaveLength(0);
  });

  it('when an advisory clause fails, then its result reads "Fail · advisory", apart from a mandatory failure', () => {
    const fixture = TestBed.createComponent(ChecklistTable);
    fixture.componentRef.setInput('checklist', {
      ...CHECKLIST,
      rows: [row('5.3', 'mandatory', 'fail'), row('4.3', 'advisory', 'fail')],
    });
    fixture.detectChanges();
    const labels = [...(fixture.nativeElement as HTMLElement).querySelectorAll('.status')].map((s) => [
      s.textContent!.trim(),
      s.getAttribute('data-severity'),
    ]);
    expect(labels).toEqual([
      ['Fail', 'mandatory'],
      ['Fail · advisory', 'advisory'],
    ]);
  });
});
