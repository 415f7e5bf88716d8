import { evaluateValidInput } from '../../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync } from '../../../shared/rules';
import { checklistSync, LIFT, loadCalc, shaft, V2, V3 } from './rules-helpers';

describe('the rule set chooses the methods', () => {
  const input = loadCalc('five-segment-fatigue.json');

  it('when methods are applied, then the standard overrides the calc and the input object is left alone', () => {
    const before = JSON.stringify(input);
    const out = applyRuleSetMethods(
      { ...input, fatigue: { ...input.fatigue!, surfaceTable: '11th', kfOnMidrange: false } },
      V3,
    );
    expect(out.fatigue).toMatchObject({ surfaceTable: '9th-10th', kfOnMidrange: true, reliability: 99 });
    expect(applyRuleSetMethods(input, V2).fatigue).toMatchObject({ kfOnMidrange: false });
    expect(applyRuleSetMethods(input, LIFT).fatigue).toMatchObject({ reliability: 99 });
    expect(JSON.stringify(input)).toBe(before);
  });

  it('when a calc has no fatigue data, then only the fillet Kts fit is imposed', () => {
    const plain = shaft(50, 500);
    expect(applyRuleSetMethods(plain, V3)).toEqual({ ...plain, methods: { filletKts: V3.methods.filletKts } });
  });

  it('when a standard chooses the Norton torsion fit, then the engine uses it and no method issue remains', () => {
    // Norton, Machine Design 2nd ed., App. E torsion rows; docs/references.md lists Norton as the alternative to
    // Peterson.
    const norton = { ...V3, methods: { ...V3.methods, filletKts: 'norton' as const } };
    const applied = applyRuleSetMethods(input, norton);
    const result = evaluateValidInput(applied);
    const fillet = result.features.find((f) => f.type === 'shoulder-fillet')!;
    expect(fillet.method.Kts).toMatch(/^Norton power-law fit Kts/);
    expect(evaluateChecklistSync(applied, result, norton).methodIssues).toEqual([]);
  });

  it('when the calc was evaluated without the rule set methods, then methodIssues name each and block compliance', () => {
    const raw = { ...input, fatigue: { ...input.fatigue!, surfaceTable: '11th' as const, kfOnMidrange: false } };
    const c = evaluateChecklistSync(raw, evaluateValidInput(raw), V3);
    expect(c.methodIssues.map((i) => i.path)).toEqual(['fatigue.surfaceTable', 'fatigue.kfOnMidrange']);
    expect(c.verdict).toBe('not-compliant');
    expect(c.verdictReasons).toContain("2 methods differ from the rule set's choice");
  });

  it('when the standard asks for author-entered fillet Kt and the engine computed it, then the fillet is named', () => {
    const strict = { ...V3, version: 8001, methods: { ...V3.methods, filletKt: 'author' as const } };
    const c = checklistSync(input, strict);
    expect(c.methodIssues).toEqual([
      {
        path: 'features[1].Kt',
        message: expect.stringMatching(/requires a chart value entered by the author .* Norton/),
      },
    ]);
  });

  it('when Kt and Kts at the fillet are entered, then the fillet conforms to any fillet method', () => {
    const strict = {
      ...V3,
      version: 8002,
      methods: { ...V3.methods, filletKt: 'author' as const, filletKts: 'norton' as const },
    };
    const features = input.features!.map((f) =>
      f.type === 'shoulder-fillet' ? { ...f, Kt: 2.2, Kts: 1.8, source: 'test chart' } : f,
    );
    expect(checklistSync({ ...input, features }, strict).methodIssues).toEqual([]);
  });

  it('when the criteria differ, then the fatigue rows use the rule set criterion (Soderberg ≤ Goodman, Shigley 9th §7-4)', () => {
    const goodman = checklistSync(input, V3).rows.find((r) => r.clauseId === '5.3' && r.location.index === 1)!;
    const soderberg = checklistSync(input, {
      ...V3,
      version: 8003,
      methods: { ...V3.methods, fatigueCriterion: 'DE-Soderberg' },
    }).rows.find((r) => r.clauseId === '5.3' && r.location.index === 1)!;
    expect(soderberg.actual!).toBeLessThan(goodman.actual!);
    expect(soderberg.message).toMatch(/DE-Soderberg/);
  });
});
