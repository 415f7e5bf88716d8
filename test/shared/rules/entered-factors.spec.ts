import { checklistSync, only, rowsOf, shaft, V3 } from './rules-helpers';

// KFD-ENG-014 v3 §6.3–6.5: an author-entered keyseat factor may not be below Shigley 9th Table 7-1
// first-iteration values: end-mill Kt 2.14, Kts 3.0 [sourced]; sled-runner Kt 1.7 [from memory].
const RS = only(V3, ['6.3', '6.4', '6.5']);
const SOURCE = 'test chart value';

const withKeyseat = (form: 'end-mill' | 'sled-runner', factors: { Kt?: number; Kts?: number }) =>
  shaft(50, 500, undefined, { features: [{ type: 'keyseat', form, at: 500, ...factors, source: SOURCE }] });

describe('author-entered keyseat factors', () => {
  it.each([
    ['end-mill Kt 2.13', 'end-mill', { Kt: 2.13 }, '6.3', 'fail'],
    ['end-mill Kt 2.14', 'end-mill', { Kt: 2.14 }, '6.3', 'pass'],
    ['end-mill Kts 2.9', 'end-mill', { Kts: 2.9 }, '6.4', 'fail'],
    ['end-mill Kts 3.0', 'end-mill', { Kts: 3.0 }, '6.4', 'pass'],
    ['sled-runner Kt 1.6', 'sled-runner', { Kt: 1.6, Kts: 2 }, '6.5', 'fail'],
    ['sled-runner Kt 1.7', 'sled-runner', { Kt: 1.7, Kts: 2 }, '6.5', 'pass'],
  ] as const)('when the author enters %s, then clause %s is %s', (_n, form, factors, clause, status) => {
    const c = checklistSync(withKeyseat(form, factors), RS);
    const [row] = rowsOf(c, clause);
    expect(row.status).toBe(status);
    expect(row.utilisationBasis).toBe('limit/actual');
    expect(c.verdict).toBe(status === 'pass' ? 'compliant' : 'not-compliant');
  });

  it('when the factors are computed from Table 7-1 (not entered), then the entered-factor clauses do not apply', () => {
    const c = checklistSync(
      shaft(50, 500, undefined, { features: [{ type: 'keyseat', form: 'end-mill', at: 500 }] }),
      RS,
    );
    expect(c.rows.map((r) => r.status)).toEqual(['not-applicable', 'not-applicable', 'not-applicable']);
  });

  it('when only Kt is entered, then the Kts clause does not apply and Kt is judged', () => {
    const c = checklistSync(withKeyseat('end-mill', { Kt: 2.0 }), RS);
    expect(rowsOf(c, '6.3')[0]).toMatchObject({ status: 'fail', actual: 2.0, limit: 2.14 });
    expect(rowsOf(c, '6.4')[0].status).toBe('not-applicable');
  });
});
