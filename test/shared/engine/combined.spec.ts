import { evaluateShaft } from '../../../shared/engine';
import { expectClose, simpleShaft } from './check-helpers';

// docs/references.md C-15 [computed]: d = 50 mm, M = 800 N·m, T = 1000 N·m, Sy = 530 MPa;
// von Mises σ′ = √(σ² + 3τ²) and Tresca τmax = √((σ/2)² + τ²) (Shigley 9th §5-4, §5-5; Eqs. 7-15, 7-16).
describe('combined static loading', () => {
  const input = { ...simpleShaft(50, 1000, 500), bending: [{ at: 250, Ma: 0, Mm: 800 }] };

  it('when a 50 mm shaft carries 800 N·m bending and 1000 N·m torque, then σ′, n_y and Tresca τ match', () => {
    const s = evaluateShaft(input).segments[0];
    expectClose(s.sigmaVonMises, 96.0721);
    expectClose(s.yieldSafety, 5.51669);
    expectClose(s.tauTresca, 52.1774);
    expectClose(s.yieldSafetyTresca, 530 / (2 * 52.1774));
  });

  it('when the moment is alternating instead of steady, then the static peak is the same (σ′max uses σa + σm)', () => {
    const s = evaluateShaft({ ...input, bending: [{ at: 250, Ma: 800 }] }).segments[0];
    expectClose(s.sigmaVonMises, 96.0721);
  });

  it('when there is no load at all, then yield safety is null rather than infinite', () => {
    const s = evaluateShaft(simpleShaft(50, 0)).segments[0];
    expect(s.yieldSafety).toBeNull();
    expect(s.sigmaVonMises).toBe(0);
  });
});
