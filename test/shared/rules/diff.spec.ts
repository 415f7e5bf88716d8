import { diffRuleSets } from '../../../shared/rules';
import { LIFT, V2, V3, loadRuleSet } from './rules-helpers';

describe('diffRuleSets', () => {
  const d = diffRuleSets(V2, V3);
  const clause = (id: string) => d.clauses.find((c) => c.key === id)!;
  const param = (name: string) => d.parameters.find((p) => p.key === name)!;

  it('when v2 is compared with v3, then identity and method changes are listed field by field', () => {
    expect(d.from).toEqual({ code: 'KFD-ENG-014', version: 2 });
    expect(d.identity.map((f) => f.field)).toEqual(['version', 'status', 'effectiveDate', 'changeSummary', 'scope']);
    expect(d.methods).toEqual([{ field: 'kfOnMidrange', before: false, after: true }]);
  });

  it('when a parameter value changes, then before, after and the clauses that use it are given', () => {
    expect(param('minYieldSafety')).toMatchObject({
      change: 'changed',
      usedBy: ['5.1', '5.2'],
      fields: [{ field: 'value', before: 1.5, after: 2 }],
    });
    expect(param('minKeySafety')).toMatchObject({ change: 'added', before: null, usedBy: ['7.1', '7.2'] });
    expect(param('asmeSyFraction')).toMatchObject({ change: 'unchanged', fields: [] });
  });

  it('when clauses are added or changed, then each is marked with the fields that differ', () => {
    expect(clause('3.1')).toMatchObject({ change: 'added', before: null });
    expect(clause('4.1')).toMatchObject({ change: 'unchanged' });
    expect(clause('4.2').fields.map((f) => f.field)).toEqual(['title', 'text', 'check', 'measure']);
    expect(d.counts.clauses).toEqual({ added: 9, removed: 0, changed: 1 });
    expect(d.counts.manualItems).toEqual({ added: 1, removed: 0, changed: 0 });
  });

  it('when compared the other way, then additions become removals listed after the kept items', () => {
    const back = diffRuleSets(V3, V2);
    expect(back.counts.clauses).toEqual({ added: 0, removed: 9, changed: 1 });
    expect(back.clauses.slice(-9).every((c) => c.change === 'removed' && c.after === null)).toBe(true);
    expect(back.manualItems.find((m) => m.key === 'drawing-reference')!.change).toBe('removed');
  });

  it('when a document is compared with a copy whose keys are in another order, then nothing differs', () => {
    const reversed = (v: unknown): unknown =>
      Array.isArray(v)
        ? v.map(reversed)
        : v && typeof v === 'object'
          ? Object.fromEntries(
              Object.entries(v)
                .reverse()
                .map(([k, x]) => [k, reversed(x)]),
            )
          : v;
    const same = diffRuleSets(LIFT, reversed(LIFT) as typeof LIFT);
    expect(same.identity).toEqual([]);
    expect(same.counts).toEqual({
      parameters: { added: 0, removed: 0, changed: 0 },
      clauses: { added: 0, removed: 0, changed: 0 },
      manualItems: { added: 0, removed: 0, changed: 0 },
    });
  });

  it('when the independent-model requirement or a tolerance changes, then each shows as a changed line', () => {
    const lift2 = loadRuleSet('kfd-eng-021-v2.json');
    const tighter = {
      ...lift2,
      verification: { ...lift2.verification!, scope: { kind: 'torque-at-least' as const, value: 500 } },
    };
    tighter.verification.tolerances = { inputs: 0.001, results: 0.01 };
    expect(diffRuleSets(lift2, tighter).verification).toEqual([
      {
        field: 'checking requirement',
        before: 'Independent model required for every calc under this standard',
        after: 'Independent model required for calcs with largest external torque ≥ 500 N·m',
      },
      { field: 'checking results', before: 'Results agree when within 2 %', after: 'Results agree when within 1 %' },
    ]);
    expect(diffRuleSets(LIFT, lift2).verification.map((f) => f.field)).toContain('checking requirement');
    expect(diffRuleSets(lift2, lift2).verification).toEqual([]);
  });
});
