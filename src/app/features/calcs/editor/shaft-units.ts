import { UNIT_LABELS, type UnitSystem } from '../../../../../shared/engine/units';
import { BEAM_LABELS, STEEL_DENSITY } from '../../../../../shared/engine/beam/beam-units';

/** Unit labels the whole-shaft fields show: the engine's own, so the screen and the result always agree. */
export function shaftUnits(units: UnitSystem) {
  return { ...UNIT_LABELS[units], ...BEAM_LABELS[units] };
}

/** The density the engine assumes when the author enters none (steel). */
export const steelDensity = (units: UnitSystem): number => STEEL_DENSITY[units];
