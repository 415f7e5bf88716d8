import { evaluateShaft } from '../../../shared/engine';

// Shigley 9th Table 7-1 first-iteration estimates: end-mill keyseat Kt 2.14, Kts 3.0 [sourced];
// sled-runner Kt 1.7 [memory]; retaining-ring groove Kt 5.0, Kts 3.0 [memory].
const shaftWith = (feature: Record<string, unknown>) => ({
  units: 'SI',
  material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
  segments: [{ length: 200, od: 40, id: 0 }],
  torques: [
    { at: 0, T: 300 },
    { at: 200, T: -300 },
  ],
  features: [feature],
});

describe('keyseat and groove factors', () => {
  it('when an end-mill keyseat has no entered factors, then Table 7-1 gives Kt 2.14, Kts 3.0 and r = 0.02·d', () => {
    const f = evaluateShaft(shaftWith({ type: 'keyseat', form: 'end-mill', at: 100 })).features[0];
    expect([f.Kt, f.Kts]).toEqual([2.14, 3.0]);
    expect(f.r).toBeCloseTo(0.8, 12);
    expect(f.method.Kt).toMatch(/Table 7-1.*end-mill/);
  });

  it('when a sled-runner keyseat has Kts entered, then Kt comes from Table 7-1 (1.7) and Kts from the author', () => {
    const f = evaluateShaft(shaftWith({ type: 'keyseat', form: 'sled-runner', at: 100, Kts: 2.8, source: 'chart X' }))
      .features[0];
    expect([f.Kt, f.Kts]).toEqual([1.7, 2.8]);
    expect(f.method.Kts).toMatch(/entered by the author; source: chart X/);
  });

  it('when a ring groove is evaluated, then Table 7-1 gives Kt 5.0, Kts 3.0 on the root section', () => {
    const f = evaluateShaft(shaftWith({ type: 'ring-groove', at: 100, depth: 1, r: 0.2 })).features[0];
    expect([f.Kt, f.Kts, f.d]).toEqual([5.0, 3.0, 38]);
    // Nominal torsion on the root section: τ = 16·T/(π·d³), d = 40 − 2·1 mm (independent closed form).
    expect(f.nominal.tauM).toBeCloseTo((16 * 300e3) / (Math.PI * 38 ** 3), 10);
  });

  it('when a key is checked, then shear τ = 2T/(d·w·l) and bearing σ = 4T/(d·l·h) (Shigley 9th §7-7, from memory)', () => {
    const f = evaluateShaft(
      shaftWith({ type: 'keyseat', form: 'end-mill', at: 100, width: 12, height: 8, length: 40, Sy: 390 }),
    ).features[0];
    expect(f.key?.shearStress).toBeCloseTo((2 * 300e3) / (40 * 12 * 40), 10);
    expect(f.key?.bearingStress).toBeCloseTo((4 * 300e3) / (40 * 40 * 8), 10);
    expect(f.key?.shearSafety).toBeCloseTo((0.577 * 390) / ((2 * 300e3) / (40 * 12 * 40)), 10);
  });
});
