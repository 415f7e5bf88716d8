import { checklistSync, LIFT, loadCalc, V2, V3 } from './rules-helpers';

const FIXTURES = ['five-segment-fatigue.json', 'hollow-si.json', 'solid-si.json', 'stepped-us.json'];

describe('the invented Kestrel Fen Drives standards on the fixture calcs', () => {
  it.each(FIXTURES.flatMap((f) => [V2, V3, LIFT].map((rs) => [f, `${rs.code} v${rs.version}`, rs] as const)))(
    'when %s is checked against %s, then no row is an error and every method is as required',
    (fixture, _name, rs) => {
      const c = checklistSync(loadCalc(fixture), rs);
      expect(c.rows.filter((r) => r.status === 'error')).toEqual([]);
      expect(c.methodIssues).toEqual([]);
    },
  );

  it('when v2-compliant calcs are re-checked against v3, then impact analysis has flips to show, each naming its clause', () => {
    const flips = FIXTURES.filter(
      (f) =>
        checklistSync(loadCalc(f), V2).verdict === 'compliant' &&
        checklistSync(loadCalc(f), V3).verdict === 'not-compliant',
    );
    expect(flips).toEqual(['hollow-si.json', 'solid-si.json']);
    const failing = checklistSync(loadCalc('solid-si.json'), V3)
      .rows.filter((r) => r.status === 'fail' && r.severity === 'mandatory')
      .map((r) => r.reference);
    // §3.1 fatigue assessment required (new in v3); §4.2 twist 1° in 20 diameters (common practice, no source).
    expect(failing).toEqual(['KFD-ENG-014 v3 §3.1', 'KFD-ENG-014 v3 §4.2']);
  });

  it('when the lifting standard checks the conveyor shaft, then its stricter limits fail where v3 passes', () => {
    const c = checklistSync(loadCalc('five-segment-fatigue.json'), LIFT);
    expect(c.verdict).toBe('not-compliant');
    expect(new Set(c.rows.filter((r) => r.status === 'fail').map((r) => r.clauseId))).toEqual(
      new Set(['4.2', '5.4', '6.1']),
    );
  });

  it('when the documents are read, then they are the invented demo company and say that other rules govern where stricter', () => {
    for (const rs of [V2, V3, LIFT]) expect(rs.scope).toMatch(/Kestrel Fen Drives Ltd\. \(invented\)/);
    expect(LIFT.scope).toMatch(/govern where stricter/);
  });
});
