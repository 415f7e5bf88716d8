/*
 * Types of the material library. Values are stored in SI (GPa for moduli, MPa for strengths) and
 * converted to the calc's unit system only when they are put into a calc.
 */
export type MaterialKind = 'steel' | 'stainless-steel' | 'aluminium';

/**
 * A specified minimum is what a standard guarantees (ASTM minimum strengths); a typical value is a
 * representative figure a real bar may differ from. Checkers need to know which one they are reading.
 */
export type ValueBasis = 'specified-minimum' | 'typical';

export const BASIS_LABELS: Record<ValueBasis, string> = {
  'specified-minimum': 'specified minimum',
  typical: 'typical value',
};

export interface SourcedValue {
  value: number;
  /** Book, edition and table the value was read from. */
  source: string;
  basis: ValueBasis;
}

export type MaterialProperty = 'E' | 'G' | 'nu' | 'Sy' | 'Su';

export interface LibraryMaterial {
  id: string;
  name: string;
  kind: MaterialKind;
  /** Young's and shear moduli in GPa, Poisson's ratio dimensionless. */
  E: SourcedValue;
  G: SourcedValue;
  nu: SourcedValue;
  /** Yield and ultimate tensile strength in MPa; null where no sourced value is held. */
  Sy: SourcedValue | null;
  Su: SourcedValue | null;
  /** True when the author must enter Sy and Su (with their source, e.g. the mill certificate). */
  needsAuthorStrengths: boolean;
  note: string;
}
