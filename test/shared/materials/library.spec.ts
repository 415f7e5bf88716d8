import {
  MATERIAL_LIBRARY,
  SHIGLEY_A5,
  SHIGLEY_A20,
  findMaterial,
  matchMaterial,
  sourceText,
  toMaterialInput,
  valueIn,
} from '../../../shared/materials';
import { validateCalcInput } from '../../../shared/engine';

const mpa = (id: string) => {
  const m = findMaterial(id)!;
  return [m.Su?.value, m.Sy?.value];
};

describe('material library values against their published sources', () => {
  it.each([
    // [id, Sut MPa, Sy MPa]: Shigley 9th ed. Table A-20, ASTM minimum strengths [sourced]
    ['aisi-1018-cd', 440, 370],
    ['aisi-1020-cd', 470, 390],
    ['aisi-1045-hr', 570, 310],
    ['aisi-1045-cd', 630, 530],
    ['aisi-1050-cd', 690, 580],
  ])('when %s is read, then Sut %d and Sy %d MPa are the Table A-20 minimums', (id, su, sy) => {
    expect(mpa(id)).toEqual([su, sy]);
    const m = findMaterial(id)!;
    for (const v of [m.Su!, m.Sy!]) expect(v).toMatchObject({ source: SHIGLEY_A20, basis: 'specified-minimum' });
  });

  it.each([
    // [id, E GPa, G GPa, ν]: Shigley 9th ed. Table A-5 [sourced]
    ['aisi-1045-cd', 207, 79.3, 0.292], // carbon steel
    ['stainless-18-8', 190, 73.1, 0.305], // stainless steel 18-8
    ['aluminium-alloy', 71.7, 26.9, 0.333], // aluminium alloys
  ])('when %s is read, then E %d GPa, G %d GPa and ν %d are the Table A-5 typical values', (id, E, G, nu) => {
    const m = findMaterial(id)!;
    expect([m.E.value, m.G.value, m.nu.value]).toEqual([E, G, nu]);
    for (const v of [m.E, m.G, m.nu]) expect(v).toMatchObject({ source: SHIGLEY_A5, basis: 'typical' });
  });

  it('when a family has no sourced strength, then it holds none and asks the author for Sy and Su', () => {
    for (const id of ['stainless-18-8', 'aluminium-alloy']) {
      const m = findMaterial(id)!;
      expect([m.Sy, m.Su, m.needsAuthorStrengths]).toEqual([null, null, true]);
      expect(sourceText(m)).toMatch(/entered by the author/);
    }
  });

  it('when every entry is listed, then each value names a source and a basis', () => {
    for (const m of MATERIAL_LIBRARY) {
      for (const v of [m.E, m.G, m.nu, m.Sy, m.Su]) {
        if (v) expect(v.source.length > 0 && ['typical', 'specified-minimum'].includes(v.basis)).toBe(true);
      }
      expect(m.needsAuthorStrengths).toBe(m.Sy === null);
    }
  });

  it('when G is compared with E/(2(1+ν)), then the tabulated values agree within 1.5 % (not forced, docs/references.md)', () => {
    for (const m of MATERIAL_LIBRARY) {
      const derived = m.E.value / (2 * (1 + m.nu.value));
      expect(Math.abs(derived - m.G.value) / m.G.value).toBeLessThan(0.015);
    }
  });
});

describe('material values in a calc', () => {
  it('when 1045 CD goes into a US calc, then moduli are in Mpsi and strengths in ksi (NIST SP 811 factors)', () => {
    const m = findMaterial('aisi-1045-cd')!;
    // 1 ksi = 6.894757 MPa, so 630 MPa = 91.37377 ksi and 207 GPa = 30.0228 Mpsi [computed]
    expect(valueIn(m, 'Su', 'US')).toBeCloseTo(91.37377, 4);
    expect(valueIn(m, 'E', 'US')).toBeCloseTo(30.0228, 3);
    expect(valueIn(m, 'G', 'US')).toBeCloseTo(11.5015, 3);
    expect(valueIn(m, 'nu', 'US')).toBe(0.292);
    expect(valueIn(m, 'Su', 'SI')).toBe(630);
  });

  it('when a carbon steel is turned into calc input, then the engine accepts it as the calc material', () => {
    const material = toMaterialInput(findMaterial('aisi-1050-cd')!, 'US');
    const checked = validateCalcInput({
      units: 'US',
      material,
      segments: [{ length: 10, od: 2, id: 0 }],
      torques: [],
    });
    expect(checked.ok).toBe(true);
    expect(material.source).toMatch(/Table A-5.*typical.*Table A-20.*specified minimum/);
  });

  it('when an aluminium alloy is turned into calc input, then Sy and Su are left for the author, never invented', () => {
    const material = toMaterialInput(findMaterial('aluminium-alloy')!, 'SI');
    expect(material).not.toHaveProperty('Sy');
    expect(material).not.toHaveProperty('Su');
    expect(material).toMatchObject({ E: 71.7, G: 26.9, nu: 0.333, kind: 'aluminium' });
  });

  it('when a saved calc names its material, then the library entry is found again, case aside', () => {
    expect(matchMaterial(' aisi 1045 cd ')?.id).toBe('aisi-1045-cd');
    expect(matchMaterial('AISI 4140 QT')).toBeUndefined();
    expect(matchMaterial(undefined)).toBeUndefined();
  });
});
