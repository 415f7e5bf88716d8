import { safetyFactor, trescaShear, vonMises } from './combined';
import type { SafetyByCriterion } from './fatigue-criteria';

export const CRITERIA = ['goodman', 'asmeElliptic', 'gerber', 'soderberg'] as const;
export type Criterion = (typeof CRITERIA)[number];

/** Keeps the point of largest von Mises stress met while scanning stations (stresses in MPa). */
export class StaticTracker {
  sigmaVonMises = 0;
  tauTresca = 0;
  at = Number.NaN;
  Ma = 0;
  Mm = 0;

  consider(x: number, sigma: number, tau: number, Ma: number, Mm: number): void {
    const vm = vonMises(sigma, tau);
    if (vm > this.sigmaVonMises || Number.isNaN(this.at)) {
      this.sigmaVonMises = vm;
      this.at = x;
      this.Ma = Ma;
      this.Mm = Mm;
    }
    this.tauTresca = Math.max(this.tauTresca, trescaShear(sigma, tau));
  }

  yieldSafety(Sy: number): number | null {
    return safetyFactor(Sy, this.sigmaVonMises);
  }

  yieldSafetyTresca(Sy: number): number | null {
    return safetyFactor(Sy, 2 * this.tauTresca);
  }
}

/** Keeps, for each criterion, the lowest safety factor and its station (null = unloaded so far). */
export class FatigueTracker {
  readonly safety: SafetyByCriterion = { goodman: null, asmeElliptic: null, gerber: null, soderberg: null };
  readonly at: Record<Criterion, number> = { goodman: 0, asmeElliptic: 0, gerber: 0, soderberg: 0 };

  consider(x: number, s: SafetyByCriterion): void {
    for (const c of CRITERIA) {
      const v = s[c];
      const cur = this.safety[c];
      if (v !== null && (cur === null || v < cur)) {
        this.safety[c] = v;
        this.at[c] = x;
      }
    }
  }
}
