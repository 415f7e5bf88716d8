/** Geometric properties of a round solid or hollow section (any consistent length unit). */
export interface SectionProps {
  /** Polar second moment of area J = π(do⁴ − di⁴)/32. */
  J: number;
  /** Polar section modulus Zp = J / (do/2). */
  Zp: number;
  /** Bending section modulus Z = I / (do/2) = Zp / 2. */
  Z: number;
}

export const J_FORMULA = 'J = π·(do⁴ − di⁴)/32 (π·d⁴/32 when solid)';
export const ZP_FORMULA = 'Zp = J/c, c = do/2';

export function polarMoment(od: number, id: number): number {
  const o2 = od * od;
  const i2 = id * id;
  return (Math.PI * (o2 * o2 - i2 * i2)) / 32;
}

export function sectionProps(od: number, id: number): SectionProps {
  const J = polarMoment(od, id);
  const Zp = J / (od / 2);
  return { J, Zp, Z: Zp / 2 };
}

/** Shear stress at radius rho under torque T: τ = T·ρ/J (torque and length units consistent with J). */
export function shearAt(T: number, rho: number, J: number): number {
  return (T * rho) / J;
}
