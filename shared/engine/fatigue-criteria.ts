/*
 * Distortion-energy fatigue criteria for combined bending and torsion (Shigley 9th §7-4,
 * Eqs. 7-7 to 7-14), written with the von Mises alternating and midrange stresses
 * σ′a = √(σa² + 3τa²), σ′m = √(σm² + 3τm²) so that one form serves solid and hollow sections.
 */
import { finite } from './finite';

export interface SafetyByCriterion {
  goodman: number | null;
  asmeElliptic: number | null;
  gerber: number | null;
  soderberg: number | null;
}

export const CRITERIA_METHODS: Record<keyof SafetyByCriterion, string> = {
  goodman: 'DE-Goodman 1/n = σ′a/Se + σ′m/Sut (Shigley 9th Eq. 7-7/7-8)',
  asmeElliptic: 'DE-ASME-elliptic 1/n = √((σ′a/Se)² + (σ′m/Sy)²) (Shigley 9th Eq. 7-11/7-12)',
  gerber: 'DE-Gerber 1/n = [σ′a + √(σ′a² + (2σ′m·Se/Sut)²)]/(2Se) (Shigley 9th Eq. 7-9/7-10)',
  soderberg: 'DE-Soderberg 1/n = σ′a/Se + σ′m/Sy (Shigley 9th Eq. 7-13/7-14)',
};

// 1/n is exactly 0 only where both stresses are 0; NaN or an overflow throws instead of reading as "no load".
const inverse = (x: number): number | null =>
  finite(x, 'a fatigue utilisation') === 0 ? null : finite(1 / x, 'a fatigue safety factor');

/** Safety factors by each criterion; null where both stresses are zero (no fatigue load). */
export function fatigueSafety(vmA: number, vmM: number, Se: number, Sut: number, Sy: number): SafetyByCriterion {
  const m = (2 * vmM * Se) / Sut;
  return {
    goodman: inverse(vmA / Se + vmM / Sut),
    asmeElliptic: inverse(Math.sqrt((vmA / Se) ** 2 + (vmM / Sy) ** 2)),
    // Gerber rearranged so that σ′a → 0 tends smoothly to σ′m/Sut instead of dividing by zero.
    gerber: inverse((vmA + Math.sqrt(vmA * vmA + m * m)) / (2 * Se)),
    soderberg: inverse(vmA / Se + vmM / Sy),
  };
}
