import { evaluateShaft } from '../../../shared/engine';
import { temperatureFactor } from '../../../shared/engine/marin';
import { expectClose, simpleShaft } from './check-helpers';

// Input options beyond the defaults: alternating torque, Kf on the midrange, temperature, editions,
// per-segment materials, bending interpolation.
const keyed = (extra: Record<string, unknown> = {}, fatigue: Record<string, unknown> = {}): Record<string, any> => ({
  ...simpleShaft(40, 400, 300),
  features: [{ type: 'keyseat', form: 'end-mill', at: 150 }],
  bending: [
    { at: 0, Ma: 0 },
    { at: 150, Ma: 300 },
    { at: 300, Ma: 0 },
  ],
  fatigue: { surface: 'machined', ...fatigue },
  ...extra,
});

describe('calc options', () => {
  it('when torques carry Ta, then the alternating diagram is their running sum (in phase)', () => {
    const input = keyed();
    input.torques = [
      { at: 0, T: 400, Ta: 80 },
      { at: 300, T: -400, Ta: -80 },
    ];
    const r = evaluateShaft(input);
    expect(r.torqueDiagram.map((p) => p.Ta)).toEqual([80]);
    expect(r.features[0].Ta).toBe(80);
  });

  it('when an alternating fraction is given, then Ta = fraction × |Tm|', () => {
    const r = evaluateShaft(keyed({}, { alternatingTorqueFraction: 0.25 }));
    expect(r.features[0].Ta).toBeCloseTo(100, 12);
  });

  it('when Kf is not applied to the midrange, then peak midrange stresses equal the nominal ones', () => {
    const f = evaluateShaft(keyed({}, { kfOnMidrange: false })).features[0];
    expect(f.peak.tauM).toBe(f.nominal.tauM);
    expectClose(f.peak.sigmaA, f.Kf * f.nominal.sigmaA, 1e-12);
  });

  it('when bending is entered at stations, then the moment between them is interpolated linearly', () => {
    const input = keyed();
    input.features = [{ type: 'keyseat', form: 'end-mill', at: 75 }];
    expect(evaluateShaft(input).features[0].Ma).toBeCloseTo(150, 12);
  });

  it('when an operating temperature is given, then kd follows the Eq. 6-27 polynomial (Shigley 9th, from memory)', () => {
    const f = evaluateShaft(keyed({}, { temperature: 250 })).features[0];
    expectClose(f.endurance?.kd, temperatureFactor(250), 1e-12);
    expect(f.endurance!.kd).toBeLessThan(1.03);
  });

  it('when the 11th-edition surface table is chosen, then ka changes and a warning says the row is from memory', () => {
    const r = evaluateShaft(keyed({}, { surfaceTable: '11th' }));
    expectClose(r.features[0].endurance?.ka, 3.04 * 630 ** -0.217, 1e-12);
    expect(r.warnings.map((w) => w.path)).toContain('fatigue.surfaceTable');
  });

  it('when a reliability of 99 % is asked, then ke = 0.814 (Shigley 9th Table 6-5)', () => {
    expect(evaluateShaft(keyed({}, { reliability: 99 })).segments[0].endurance?.ke).toBe(0.814);
  });

  it('when a segment has its own aluminium material, then its G is used and the steel-only methods are flagged', () => {
    const input = keyed();
    input.segments = [
      { length: 150, od: 40, id: 0 },
      {
        length: 150,
        od: 40,
        id: 0,
        material: { name: 'Al 6061-T6', kind: 'aluminium', E: 71.7, G: 26.9, Sy: 276, Su: 310 },
      },
    ];
    const r = evaluateShaft(input);
    // Shigley 9th Table A-5 aluminium alloys G = 26.9 GPa [sourced]: twist ratio follows G.
    expectClose(r.segments[1].twist / r.segments[0].twist, 79.3 / 26.9, 1e-12);
    expect(r.warnings.map((w) => w.path)).toContain('segments[1].material.kind');
  });

  it('when a US calc is printed as a table, then the headers carry US units', async () => {
    const { formatResultTable } = await import('../../../shared/engine');
    const r = evaluateShaft({ ...simpleShaft(2, 5000, 20), units: 'US', material: { E: 30, G: 11.5, Sy: 54, Su: 64 } });
    const text = formatResultTable(r);
    expect(text).toMatch(/T lbf·in/);
    expect(text).toMatch(/tauMax ksi/);
    expect(text).toMatch(/deg\/ft/);
  });
});
