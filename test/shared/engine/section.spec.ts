import integrate from 'integrate-adaptive-simpson';
import { polarMoment, sectionProps, shearAt } from '../../../shared/engine/section';
import { expectClose as close } from './check-helpers';

// Check values are [computed] in docs/references.md from J = π·d⁴/32, π·(do⁴ − di⁴)/32 (Shigley 9th
// Table A-18, from memory); relative tolerance 1e-6 unless noted.

describe('section properties', () => {
  it.each([
    // [label, od, id, J, Zp] — docs/references.md C-1 to C-3 [computed]
    ['solid 50 mm', 50, 0, 613592.3, 24543.69],
    ['hollow 60/40 mm', 60, 40, 1021017.6, 34033.92],
    ['solid 2 in', 2, 0, 1.570796, null],
    ['hollow 3/2 in', 3, 2, 6.38136, null],
  ])('when the section is %s, then J and Zp match the closed form', (_label, od, id, J, Zp) => {
    const props = sectionProps(od, id);
    close(props.J, J);
    if (Zp !== null) close(props.Zp, Zp);
  });

  it('when J is integrated numerically over thin rings, then it matches the closed form (second route)', () => {
    // J = ∫ρ² dA = ∫ 2π·ρ³ dρ from ri to ro, integrated by adaptive Simpson (integrate-adaptive-simpson).
    const ring = (rho: number): number => 2 * Math.PI * rho ** 3;
    close(integrate(ring, 20, 30, 1e-10), polarMoment(60, 40), 1e-9);
    close(integrate(ring, 0, 25, 1e-10), polarMoment(50, 0), 1e-9);
    close(integrate(ring, 0.5, 1.5, 1e-12), polarMoment(3, 1), 1e-9);
  });

  it('when J is summed over 4000 thin rings ρ²·2πρ·Δρ (midpoint rule), then it converges to the closed form', () => {
    // A third route with no library: midpoint error is O(Δρ²), so 4000 rings give about 1e-7.
    const rings = 4000;
    const [ri, ro] = [20, 30];
    const dr = (ro - ri) / rings;
    let sum = 0;
    for (let k = 0; k < rings; k++) {
      const rho = ri + (k + 0.5) * dr;
      sum += rho * rho * 2 * Math.PI * rho * dr;
    }
    close(sum, 1021017.6, 1e-6);
  });

  it('when the torque is 1000 N·m on a solid 50 mm shaft, then τ at ρ = 15 mm is 24.44620 MPa', () => {
    // docs/references.md C-4 [computed], τ(ρ) = T·ρ/J with T in N·mm.
    close(shearAt(1e6, 15, polarMoment(50, 0)), 24.4462);
    close(shearAt(1e6, 25, polarMoment(50, 0)), 40.74367);
  });
});
