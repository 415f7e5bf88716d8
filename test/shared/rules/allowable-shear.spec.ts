import {
  checklistAsync,
  checklistSync,
  only,
  rowsOf,
  shaft,
  STEEL_1018_HR,
  STEEL_1045_CD,
  torqueForShear,
  V3,
  type Material,
} from './rules-helpers';

// Old ASME Code for Design of Transmission Shafting, sourced via Schaum's Outline of Machine Design:
// allowable shear = lesser of 0.30·Sy and 0.18·Su, × 0.75 where keyways are present.
// Expected values: docs/references.md C-9 [computed]: 1045 CD → 113.4 / 85.05 MPa; 1018 HR → 66.0 / 49.5 MPa.
const ASME_ONLY = only(V3, ['4.1']);
const D = 50;
const KEYSEAT = { features: [{ type: 'keyseat' as const, form: 'end-mill' as const, at: 500 }] };

describe.each([
  ['1045 CD, plain: 0.18·Su governs', STEEL_1045_CD, false, 113.4],
  ['1045 CD, keyseat: 0.75 × 0.18·Su', STEEL_1045_CD, true, 85.05],
  ['1018 HR, plain: 0.30·Sy governs', STEEL_1018_HR, false, 66.0],
  ['1018 HR, keyseat: 0.75 × 0.30·Sy', STEEL_1018_HR, true, 49.5],
])('old ASME allowable shear, %s (docs/references.md C-9)', (_name, material: Material, hasKeyseat, allowable) => {
  const calc = (tau: number) => shaft(D, torqueForShear(tau, D), material, hasKeyseat ? KEYSEAT : {});

  it(`when evaluated, then the row's limit is ${allowable} MPa`, () => {
    const [row] = rowsOf(checklistSync(calc(allowable * 0.5), ASME_ONLY), '4.1');
    expect(row.limit).toBeCloseTo(allowable, 9);
    expect(row.unit).toBe('MPa');
    expect(row.utilisationBasis).toBe('actual/limit');
    expect(row.utilisation).toBeCloseTo(0.5, 9);
  });

  it('when τmax is 1e-6 below the limit, then the row passes and the calc is compliant', async () => {
    for (const c of [
      checklistSync(calc(allowable * (1 - 1e-6)), ASME_ONLY),
      await checklistAsync(calc(allowable * (1 - 1e-6)), ASME_ONLY),
    ]) {
      expect(rowsOf(c, '4.1')[0].status).toBe('pass');
      expect(c.verdict).toBe('compliant');
    }
  });

  it('when τmax is 1e-6 above the limit, then the row fails and the calc is not compliant', async () => {
    for (const c of [
      checklistSync(calc(allowable * (1 + 1e-6)), ASME_ONLY),
      await checklistAsync(calc(allowable * (1 + 1e-6)), ASME_ONLY),
    ]) {
      const [row] = rowsOf(c, '4.1');
      expect(row.status).toBe('fail');
      expect(row.message).toMatch(/exceeds the limit of/);
      expect(c.verdict).toBe('not-compliant');
      expect(c.verdictReasons).toEqual(['1 mandatory row fails']);
    }
  });
});

describe('old ASME allowable shear outside steel', () => {
  it('when the material is aluminium, then the row carries a steel-only warning', () => {
    // Invented aluminium values for the test; the clause is marked materialScope "steel".
    const alu: Material = { name: 'test aluminium', kind: 'aluminium', E: 71.7, G: 26.9, Sy: 240, Su: 290 };
    const [row] = rowsOf(checklistSync(shaft(D, 500, alu), ASME_ONLY), '4.1');
    expect(row.status).toBe('pass');
    expect(row.warnings).toEqual([expect.stringMatching(/written for steel; this location is aluminium/)]);
    // 0.30·240 = 72 < 0.18·290 = 52.2 → 52.2 MPa [computed]
    expect(row.limit).toBeCloseTo(52.2, 9);
  });

  it('when the material is steel, then there is no warning', () => {
    expect(rowsOf(checklistSync(shaft(D, 500), ASME_ONLY), '4.1')[0].warnings).toEqual([]);
  });
});
