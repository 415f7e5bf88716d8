/* The shape of a fact in the registry, and helpers to declare one. */
export type FactType = 'number' | 'boolean' | 'string' | 'object';
export type FactQuantity =
  'length' | 'torque' | 'stress' | 'modulus' | 'angle' | 'twistPerLength' | 'speed' | 'rad' | 'h' | '1';

/** Quantities whose value is the same in both unit systems (shown unconverted). */
export const PLAIN_QUANTITIES: ReadonlySet<FactQuantity> = new Set(['1', 'angle', 'speed', 'rad', 'h']);

export interface FactSpec {
  type: FactType;
  /** null means "not computed here" (no key data, no fatigue block) or "no load" for safety factors. */
  isNullable: boolean;
  quantity: FactQuantity | null;
  label: string;
  /** Allowed values of a string fact, members of an object fact. */
  values?: readonly string[];
  /** Parameters a derived fact is computed from; the rule set must define them as numbers. */
  params?: readonly string[];
}

export const num = (quantity: FactQuantity, label: string, isNullable = false): FactSpec => ({
  type: 'number',
  isNullable,
  quantity,
  label,
});
export const bool = (label: string): FactSpec => ({ type: 'boolean', isNullable: false, quantity: null, label });
export const str = (label: string, values?: readonly string[], isNullable = false): FactSpec => ({
  type: 'string',
  isNullable,
  quantity: null,
  label,
  values,
});
