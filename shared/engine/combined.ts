import { finite } from './finite';

// Combined static stresses on a round section: Shigley 9th §5-4, §5-5 and §7-4.
export const VON_MISES_FORMULA = 'σ′ = √(σ² + 3τ²) (distortion energy); n_y = Sy/σ′max, Shigley 9th Eqs. 7-15, 7-16';
export const TRESCA_FORMULA = 'τmax = √((σ/2)² + τ²) (maximum shear); n = Sy/(2·τmax)';

export function vonMises(sigma: number, tau: number): number {
  return Math.sqrt(sigma * sigma + 3 * tau * tau);
}

export function trescaShear(sigma: number, tau: number): number {
  return Math.sqrt(0.25 * sigma * sigma + tau * tau);
}

/**
 * strength/stress, or null for an unloaded point (stress exactly 0): an infinite factor cannot
 * travel in JSON. A non-finite stress or quotient throws, so an overflow never reads as "no load".
 */
export function safetyFactor(strength: number, stress: number): number | null {
  if (finite(stress, 'a stress') === 0) return null;
  return finite(strength / stress, 'a safety factor');
}
