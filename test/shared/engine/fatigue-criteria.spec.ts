import { vonMises } from '../../../shared/engine/combined';
import { fatigueSafety } from '../../../shared/engine/fatigue-criteria';
import { expectClose } from './check-helpers';

// docs/references.md C-14 [computed from Shigley 9th §7-4, Eqs. 7-7 to 7-16 (sourced)]:
// US, d = 1.25 in, Ma = 2000 lbf·in, Tm = 3000 lbf·in, Mm = Ta = 0, Kf 1.7, Kfs 1.4, Se 35, Sut 90, Sy 70 kpsi.
describe('DE fatigue criteria', () => {
  const d = 1.25;
  const c = 16 / (Math.PI * d ** 3);
  // Shigley's A = √(4(Kf·Ma)² + 3(Kfs·Ta)²), B = √(4(Kf·Mm)² + 3(Kfs·Tm)²), in lbf·in → σ′ = 16A/(πd³) psi.
  const A = Math.sqrt(4 * (1.7 * 2000) ** 2);
  const B = Math.sqrt(3 * (1.4 * 3000) ** 2);
  const s = fatigueSafety((c * A) / 1000, (c * B) / 1000, 35, 90, 70);

  it.each([
    ['goodman', 1.39395],
    ['gerber', 1.71574],
    ['asmeElliptic', 1.74052],
    ['soderberg', 1.286],
  ] as const)('when the %s criterion is applied, then n = %s (1e-5)', (criterion, n) => {
    expectClose(s[criterion], n, 1e-5);
  });

  it('when the first-cycle yield check is made, then n_y = 2.69581 (Eqs. 7-15, 7-16; 1e-5)', () => {
    const sigma = (32 * 1.7 * 2000) / (Math.PI * d ** 3);
    const tau = (16 * 1.4 * 3000) / (Math.PI * d ** 3);
    expectClose(70000 / vonMises(sigma, tau), 2.69581, 1e-5);
  });

  it('when there is no alternating stress, then Gerber tends to Sut/σ′m instead of dividing by zero', () => {
    expectClose(fatigueSafety(0, 30, 35, 90, 70).gerber, 3, 1e-12);
  });

  it('when nothing is loaded, then every factor is null (an infinite factor cannot travel in JSON)', () => {
    expect(fatigueSafety(0, 0, 35, 90, 70)).toEqual({
      goodman: null,
      asmeElliptic: null,
      gerber: null,
      soderberg: null,
    });
  });
});
