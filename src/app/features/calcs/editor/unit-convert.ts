import type { UnitSystem } from '../../../../../shared/engine/units';
import type { EditorValue } from './editor-form';
import { convertValue } from './shaft-conversion';

/** The last switch: the values before it and right after it. */
export interface Conversion {
  before: EditorValue;
  after: EditorValue;
}

// Leaf by leaf: a value untouched since the last switch goes back to exactly what was there before it.
function mergeBack(converted: unknown, current: unknown, after: unknown, before: unknown): unknown {
  if (typeof converted === 'string') return current === after && typeof before === 'string' ? before : converted;
  if (Array.isArray(converted)) {
    const same =
      Array.isArray(after) &&
      Array.isArray(before) &&
      (current as unknown[]).length === after.length &&
      after.length === before.length;
    return same ? converted.map((c, i) => mergeBack(c, (current as unknown[])[i], after[i], before[i])) : converted;
  }
  if (converted && typeof converted === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, c] of Object.entries(converted)) {
      const pick = (o: unknown) => (o && typeof o === 'object' ? (o as Record<string, unknown>)[k] : undefined);
      out[k] = mergeBack(c, pick(current), pick(after), pick(before));
    }
    return out;
  }
  return converted;
}

/**
 * Switches units. Switching back restores the values typed before the last switch wherever they were
 * not edited in between, so SI → US → SI never turns 28 into 28.00000001; edited values are converted.
 */
export function switchUnits(
  current: EditorValue,
  to: UnitSystem,
  last: Conversion | null,
): { value: EditorValue; conversion: Conversion } {
  const converted = convertValue(current, to);
  const value =
    last && last.before.units === to && last.after.units === current.units
      ? (mergeBack(converted, current, last.after, last.before) as EditorValue)
      : converted;
  return { value, conversion: { before: current, after: value } };
}
