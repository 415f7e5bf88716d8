import { evaluateValidInput } from '../../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, type RuleSet } from '../../../shared/rules';
import { evaluateChecklist } from '../../../shared/rules/reference-checklist';
import { checklistAsync, checklistSync, loadCalc, only, rowsOf, shaft, V3 } from './rules-helpers';

/** v3 with one clause's check replaced, bypassing validation (as a hand-edited database row could). */
function withCheck(id: string, check: unknown, version: number): RuleSet {
  return {
    ...V3,
    version,
    clauses: V3.clauses.map((c) => (c.id === id ? { ...c, check: check as RuleSet['clauses'][number]['check'] } : c)),
  };
}

describe('a rule that throws is an error row, never a pass', () => {
  it.each([
    [
      'an undefined parameter',
      { all: [{ fact: 'yieldSafety', operator: 'greaterThanInclusive', value: { fact: 'param:missing' } }] },
      /Undefined fact: param:missing/,
    ],
    [
      'an unknown operator',
      { all: [{ fact: 'yieldSafety', operator: 'atLeast', value: 2 }] },
      /Unknown operator: atLeast/,
    ],
    [
      'an "in" without a list',
      { all: [{ fact: 'yieldSafety', operator: 'in', value: 2 }] },
      /indexOf is not a function/,
    ],
    ['a malformed condition', { all: [{ operator: 'equal', value: 2 }] }, /"fact" property required/],
  ])(
    'when clause 5.1 has %s, then its rows are "error" on both paths and the verdict is not compliant',
    async (_n, check, reason) => {
      const rs = withCheck('5.1', check, 7000 + reason.source.length);
      const input = loadCalc('five-segment-fatigue.json');
      for (const c of [checklistSync(input, rs), await checklistAsync(input, rs)]) {
        const rows = rowsOf(c, '5.1');
        expect(rows).toHaveLength(5);
        for (const r of rows) {
          expect(r.status).toBe('error');
          expect(r.message).toMatch(/^could not be evaluated: /);
          expect(r.message).toMatch(reason);
        }
        // The other clauses are unaffected.
        expect(rowsOf(c, '5.3').every((r) => r.status === 'pass')).toBe(true);
        expect(c.verdict).toBe('not-compliant');
        expect(c.verdictReasons).toContain('5 mandatory rows could not be evaluated');
      }
    },
  );

  it('when a check passes while its measure is past the limit, then the row is an error naming the disagreement', () => {
    const rs = withCheck('4.1', { all: [{ fact: 'tauMax', operator: 'lessThan', value: 1e9 }] }, 7100);
    const c = checklistSync(shaft(50, 3000), only(rs, ['4.1']));
    expect(rowsOf(c, '4.1')[0]).toMatchObject({
      status: 'error',
      message: expect.stringMatching(/check and measure disagree/),
    });
  });

  it('when an unloaded location has no safety factor, then the clause does not apply there (isLoaded)', () => {
    // Segment 1 of a two-segment shaft carries no torque and no bending.
    const input = {
      ...shaft(50, 500),
      segments: [
        { length: 200, od: 50, id: 0 },
        { length: 800, od: 50, id: 0 },
      ],
      torques: [
        { at: 200, T: 500 },
        { at: 1000, T: -500 },
      ],
    };
    const rows = rowsOf(checklistSync(input, only(V3, ['5.1'])), '5.1');
    expect(rows.map((r) => r.status)).toEqual(['not-applicable', 'pass']);
  });
});

describe('verdict, counts and manual items', () => {
  const input = loadCalc('five-segment-fatigue.json');

  it('when nothing mandatory fails, then the verdict is compliant and open manual items are counted apart', () => {
    const c = checklistSync(input, V3);
    expect(c.verdict).toBe('compliant');
    expect(c.counts.mandatoryFail + c.counts.mandatoryError).toBe(0);
    expect(c.counts.rows).toBe(c.counts.pass + c.counts.fail + c.counts.notApplicable + c.counts.error);
    expect(c.manualOpen).toBe(3);
    expect(c.manual.map((m) => [m.id, m.requiresAttachment])).toEqual([
      ['material-certificate', 'material-certificate'],
      ['load-cases', null],
      ['drawing-reference', 'drawing'],
    ]);
  });

  it('when the checker ticks items, then their state is shown and unknown ids become notes', async () => {
    const eff = applyRuleSetMethods(input, V3);
    const c = await evaluateChecklist(eff, evaluateValidInput(eff), V3, {
      'load-cases': { done: true, by: 'R. Checker', note: 'duty spec DS-7 rev B' },
      'no-such-item': { done: true },
    });
    expect(c.manual[1]).toEqual({
      id: 'load-cases',
      text: 'Load cases match the duty specification',
      requiresAttachment: null,
      done: true,
      by: 'R. Checker',
      note: 'duty spec DS-7 rev B',
    });
    expect(c.manualOpen).toBe(2);
    expect(c.notes).toEqual(['manual item "no-such-item" is not in KFD-ENG-014 v3; its state was ignored']);
  });

  it('when evaluated, then the checklist names the rule set, the engine version, the methods and the caution', () => {
    const c = checklistSync(input, V3);
    expect(c.ruleSet).toEqual({
      code: 'KFD-ENG-014',
      title: V3.title,
      version: 3,
      status: 'effective',
      effectiveDate: '2025-03-01',
    });
    expect(c.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(c.methods).toMatchObject({
      surfaceTable: '9th-10th',
      kfOnMidrange: true,
      reliability: 99,
      fatigueCriterion: 'DE-Goodman',
    });
    expect(c.caution).toMatch(/never replace.*qualified engineer.*local codes/);
    expect(c.rows.find((r) => r.clauseId === '5.3')!.reference).toBe('KFD-ENG-014 v3 §5.3');
  });

  it('when evaluated, then every number in the checklist is finite', () => {
    const bad: string[] = [];
    const walk = (v: unknown, p: string): void => {
      if (typeof v === 'number' && !Number.isFinite(v)) bad.push(p);
      else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, `${p}.${k}`);
    };
    walk(checklistSync(input, V3), '');
    expect(bad).toEqual([]);
  });
});

describe('a result that belongs to another calc', () => {
  it('when the result does not match the input, then both paths refuse it, saying why', async () => {
    const other = evaluateValidInput(loadCalc('solid-si.json'));
    const input = loadCalc('five-segment-fatigue.json');
    expect(() => evaluateChecklistSync(input, other, V3)).toThrow(
      /the result \(1 segments, 0 features, SI\) is not of this input \(5 segments, 3 features, SI\)/,
    );
    await expect(evaluateChecklist(input, other, V3)).rejects.toThrow(/is not of this input/);
  });
});
