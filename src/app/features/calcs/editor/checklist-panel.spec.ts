import { TestBed } from '@angular/core/testing';
import type { Checklist, RuleSet } from '../../../../../shared/rules';
import type { CalcResult } from '../../../../../shared/engine';
import { ChecklistPanel } from './checklist-panel';

const row = (clauseId: string, status: string, warnings: string[]) => ({
  clauseId,
  clauseTitle: `Clause ${clauseId}`,
  severity: 'mandatory',
  status,
  location: { label: 'segment 2' },
  actual: null,
  limit: null,
  unit: '',
  utilisation: null,
  message: 'fails',
  warnings,
});

function state(failing: number) {
  const checklist = {
    verdict: 'not-compliant',
    ruleSet: { code: 'KFD-ENG-014', version: 3 },
    counts: { pass: 0, mandatoryFail: failing, advisoryFail: 0, error: 0, notApplicable: 0 },
    verdictReasons: [`${failing} mandatory rows fail`],
    methodIssues: [],
    manual: [],
    rows: [row('4.1', 'fail', [`Kt read at r/d = 0.0${failing}`])],
  } as unknown as Checklist;
  return { kind: 'ready', checklist, ruleSet: {} as RuleSet, result: {} as CalcResult } as const;
}

describe('the live checklist panel', () => {
  it('when an edit changes the verdict reasons and warnings, then their lines are updated in place (no NG0956)', () => {
    const warn = jest.spyOn(console, 'warn').mockImplementation(() => undefined);
    try {
      const fixture = TestBed.createComponent(ChecklistPanel);
      fixture.componentRef.setInput('state', state(2));
      fixture.detectChanges();
      fixture.componentRef.setInput('state', state(3));
      fixture.detectChanges();

      const text = (fixture.nativeElement as HTMLElement).textContent!;
      expect(text).toContain('3 mandatory rows fail');
      expect(text).toContain('Kt read at r/d = 0.03');
      expect(warn.mock.calls.map((c) => String(c[0])).filter((m) => m.includes('NG0956'))).toEqual([]);
    } finally {
      warn.mockRestore();
    }
  });
});
