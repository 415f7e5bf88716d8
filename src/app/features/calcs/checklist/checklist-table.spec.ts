import { TestBed } from '@angular/core/testing';
import type { Checklist, RuleSet } from '../../../../../shared/rules';
import type { CalcResult } from '../../../../../shared/engine';
import { ChecklistTable } from './checklist-table';
import { ResultSummary } from '../editor/result-summary';

const FAIL_ROW = {
  clauseId: '5.3',
  clauseTitle: 'Fatigue safety factor',
  severity: 'mandatory',
  status: 'fail',
  location: { label: 'segment 2' },
  actual: 1.497,
  limit: 1.5,
  unit: '1',
  utilisation: 1.5 / 1.497,
  utilisationBasis: 'limit/actual',
  message: 'n = 1.497 is below 1.5',
  warnings: [],
};
const PASS_ROW = {
  ...FAIL_ROW,
  clauseId: '4.1',
  clauseTitle: 'Allowable shear',
  status: 'pass',
  actual: 41.2345678,
  limit: 54,
  unit: 'MPa',
  utilisation: 0.7636,
  message: '',
};
const CHECKLIST = { rows: [PASS_ROW, FAIL_ROW], manual: [] } as unknown as Checklist;
const RULE_SET = {
  clauses: [
    { id: '5.3', measure: { actual: 'fatigueSafety', limit: 'param:minFatigueSafety', unit: '1', sense: 'at-least' } },
  ],
} as unknown as RuleSet;

describe('numbers beside their limits', () => {
  it('when a fatigue safety of 1.497 fails a 1.5 minimum, then the table prints 1.497, 100.2 % and no unit "1"', async () => {
    const fixture = TestBed.createComponent(ChecklistTable);
    fixture.componentRef.setInput('checklist', CHECKLIST);
    fixture.detectChanges();
    await fixture.whenStable();
    const rows = [...(fixture.nativeElement as HTMLElement).querySelectorAll('tr[mat-row]')].map((tr) =>
      [...tr.querySelectorAll('td')].slice(3).map((td) => td.textContent!.replace(/\s+/g, ' ').trim()),
    );
    expect(rows).toEqual([
      ['41.23 MPa', '54 MPa', '76 %'],
      ['1.497', '1.5', '100.2 %'],
    ]);
  });

  it('when the lowest fatigue safety fails its clause, then the headline figure is marked FAILS with its limit', async () => {
    const result = {
      fields: { at: { unit: 'mm' }, tauMax: { unit: 'MPa' }, twistTotal: { unit: 'deg' } },
      length: 400,
      maxShear: { value: 41.2345, segment: 0, at: 0 },
      twistTotal: 0.1234567,
      features: [],
      minYieldSafety: { value: 3.2, where: 'segment', index: 1, at: 100 },
      minFatigueSafety: { goodman: { value: 1.497, where: 'segment', index: 1, at: 100 } },
    } as unknown as CalcResult;
    const fixture = TestBed.createComponent(ResultSummary);
    fixture.componentRef.setInput('result', result);
    fixture.componentRef.setInput('checklist', CHECKLIST);
    fixture.componentRef.setInput('ruleSet', RULE_SET);
    fixture.detectChanges();
    const fatigue = [...(fixture.nativeElement as HTMLElement).querySelectorAll('.figure')].find((f) =>
      f.textContent!.includes('fatigue'),
    )!;
    expect(fatigue.getAttribute('data-outcome')).toBe('fail');
    expect(fatigue.querySelector('.value')!.textContent).toBe('1.497');
    expect(fatigue.querySelector('.mark')!.textContent!.trim()).toBe('FAILS min 1.5 (§5.3)');
    expect((fixture.nativeElement as HTMLElement).textContent).not.toMatch(/\d 1\b/);
  });
});
