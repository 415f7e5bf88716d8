import { evaluateShaft } from '../../../shared/engine';
import { fatigueFactor, neuberSqrtA, notchSensitivity } from '../../../shared/engine/notch-sensitivity';
import { expectClose } from './check-helpers';

// Neuber q = 1/(1 + √a/√r) with √a by Shigley 9th Eq. 6-35 (Sut in kpsi) [sourced]; Kf = 1 + q(Kt − 1) (Eq. 6-32).
describe('notch sensitivity', () => {
  it('when Sut = 620 MPa and r = 2.5 mm, then q, qs, Kf, Kfs match docs/references.md C-12 (1e-5)', () => {
    const q = notchSensitivity(620, 2.5, 'bending');
    const qs = notchSensitivity(620, 2.5, 'torsion');
    expectClose(q, 0.813924, 1e-5);
    expectClose(qs, 0.853056, 1e-5);
    expectClose(fatigueFactor(2.0, q), 1.81392, 1e-5);
    expectClose(fatigueFactor(1.6, qs), 1.51183, 1e-5);
  });

  it('when the radius exceeds 4 mm, then the 4 mm value is used (Shigley Fig. 6-20 note, from memory)', () => {
    expect(notchSensitivity(620, 9, 'bending')).toBe(notchSensitivity(620, 4, 'bending'));
  });

  it('when Sut is above the range of Eq. 6-35, then the top of the range is used and q stays below 1', () => {
    const q = notchSensitivity(2000, 1, 'torsion');
    expect(q).toBeLessThanOrEqual(1);
    expect(neuberSqrtA(400, 'torsion')).toBe(neuberSqrtA(220, 'torsion'));
  });

  it('when the engine meets such a material, then it warns on material.Su', () => {
    const r = evaluateShaft({
      units: 'SI',
      material: { E: 207, G: 79.3, Sy: 1700, Su: 2000 },
      segments: [{ length: 100, od: 20, id: 0 }],
      torques: [],
      features: [{ type: 'keyseat', form: 'end-mill', at: 50 }],
    });
    expect(r.warnings.map((w) => w.path)).toContain('material.Su');
  });
});
