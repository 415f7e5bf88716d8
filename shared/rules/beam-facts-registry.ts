import { SUPPORT_KINDS } from '../engine';
import { bool, num, str, type FactSpec } from './fact-spec';

/*
 * Facts of the bearings (scope "support") and the loads (scope "load") from the beam model.
 * Slopes are in rad and lives in hours, the same in both unit systems. allowableSlope is derived
 * from the rule set's per-kind parameters, so one clause checks every bearing against its own kind.
 */
export const SLOPE_PARAMS: Readonly<Record<(typeof SUPPORT_KINDS)[number], string>> = {
  'deep-groove-ball': 'maxSlopeDeepGrooveBall',
  'cylindrical-roller': 'maxSlopeCylindricalRoller',
  'tapered-roller': 'maxSlopeTaperedRoller',
  'spherical-roller': 'maxSlopeSphericalRoller',
  'self-aligning-ball': 'maxSlopeSelfAligningBall',
  plain: 'maxSlopePlain',
};

export const LOAD_KINDS = ['force', 'gear', 'pulley', 'sprocket', 'coupling'] as const;

export const SUPPORT: Record<string, FactSpec> = {
  index: num('1', 'bearing index'),
  kind: str('bearing kind', SUPPORT_KINDS),
  at: num('length', 'station'),
  isLocating: bool('bearing locates the shaft axially'),
  hasRating: bool('dynamic load rating C entered'),
  slope: num('rad', 'shaft slope at the bearing (resultant)'),
  allowableSlope: { ...num('rad', 'allowable slope for this bearing kind'), params: Object.values(SLOPE_PARAMS) },
  L10: num('1', 'basic rating life L10 in millions of revolutions', true),
  L10h: num('h', 'basic rating life L10h', true),
};

export const LOAD: Record<string, FactSpec> = {
  index: num('1', 'load index'),
  kind: str('load kind', LOAD_KINDS),
  at: num('length', 'station'),
  isGear: bool('the load is a gear mesh'),
  deflection: num('length', 'transverse deflection at the load (resultant)'),
  slope: num('rad', 'shaft slope at the load (resultant)'),
};
