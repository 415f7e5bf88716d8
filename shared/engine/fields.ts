import { beamFields } from './beam/beam-fields';
import { TRESCA_FORMULA, VON_MISES_FORMULA } from './combined';
import { ENDURANCE_METHOD } from './endurance';
import { CRITERIA_METHODS } from './fatigue-criteria';
import { POWER_METHOD } from './power';
import type { FieldInfo } from './result';
import { J_FORMULA, ZP_FORMULA } from './section';
import { UNIT_LABELS, type UnitSystem } from './units';

type Spec = [field: string, quantity: keyof (typeof UNIT_LABELS)['SI'] | '1', formula: string];

// Unit and formula of every numeric field name in the result; built once per unit system.
const SPECS: Spec[] = [
  ['start', 'length', 'station from the left end of the first segment'],
  ['end', 'length', 'station'],
  ['length', 'length', 'segment length'],
  ['od', 'length', 'outer diameter'],
  ['id', 'length', 'inner diameter'],
  ['at', 'length', 'station'],
  ['D', 'length', 'larger diameter at a shoulder'],
  ['d', 'length', 'diameter of the nominal section'],
  ['di', 'length', 'inner diameter of the nominal section'],
  ['r', 'length', 'notch radius'],
  ['J', 'J', J_FORMULA],
  ['Zp', 'Zp', ZP_FORMULA],
  ['G', 'modulus', 'shear modulus'],
  ['Sy', 'stress', 'yield strength'],
  ['Su', 'stress', 'ultimate tensile strength'],
  [
    'T',
    'torque',
    'internal torque: torque of the part right of the section on the part left of it, positive along +x ' +
      '(right-hand rule) = −Σ external torques left of the section',
  ],
  ['Tm', 'torque', 'midrange torque |T| at the station'],
  ['Ta', 'torque', 'alternating torque amplitude'],
  [
    'Ma',
    'torque',
    'alternating bending moment Ma = M (beam model, rotating shaft) + entered Ma, linear between entries',
  ],
  ['Mm', 'torque', 'midrange bending moment'],
  ['tauMax', 'stress', 'τmax = |T|·c/J, c = do/2'],
  ['tauMaxAt', 'length', 'start of the stretch carrying τmax'],
  ['tauInner', 'stress', 'τ = |T|·(di/2)/J'],
  ['gamma', '1', 'γ = τmax/G (shear strain, rad)'],
  [
    'twist',
    'angle',
    "φ = Σ T·L/(G·J): right-hand rotation about +x of the segment's right end relative to its left end",
  ],
  ['twistTotal', 'angle', 'φ = Σ Tᵢ·Lᵢ/(Gᵢ·Jᵢ), left end to right end'],
  ['twistPerLength', 'twistPerLength', '|T|max/(G·J)'],
  ['twistStart', 'angle', 'accumulated twist from the left end'],
  ['sigmaA', 'stress', 'σa = Ma/Z (nominal) or Kf·Ma/Z (peak), Z = π(do⁴ − di⁴)/(32·do)'],
  ['sigmaM', 'stress', 'σm = Mm/Z (nominal) or Kf·Mm/Z (peak)'],
  ['tauA', 'stress', 'τa = Ta/Zp (nominal) or Kfs·Ta/Zp (peak)'],
  ['tauM', 'stress', 'τm = |T|/Zp (nominal) or Kfs·|T|/Zp (peak)'],
  ['sigmaVonMises', 'stress', VON_MISES_FORMULA],
  ['tauTresca', 'stress', TRESCA_FORMULA],
  ['yieldSafety', '1', 'n_y = Sy/σ′max (Shigley 9th Eq. 7-16)'],
  ['yieldSafetyTresca', '1', 'n = Sy/(2·τmax)'],
  ['Kf', '1', 'Kf = 1 + q(Kt − 1) (Shigley 9th Eq. 6-32)'],
  ['Kfs', '1', 'Kfs = 1 + qs(Kts − 1)'],
  ['Se', 'stress', ENDURANCE_METHOD],
  ['SePrime', 'stress', 'Se′ = 0.5·Sut (Shigley 9th Eq. 6-8); SI: 700 MPa above 1400 MPa; US: 100 kpsi above 200 kpsi'],
  ['goodman', '1', CRITERIA_METHODS.goodman],
  ['asmeElliptic', '1', CRITERIA_METHODS.asmeElliptic],
  ['gerber', '1', CRITERIA_METHODS.gerber],
  ['soderberg', '1', CRITERIA_METHODS.soderberg],
  ['shearStress', 'stress', 'key shear τ = 2T/(d·w·l)'],
  ['bearingStress', 'stress', 'key bearing σ = 4T/(d·l·h)'],
  ['torqueFromPower', 'torque', POWER_METHOD],
];

function build(system: UnitSystem): Readonly<Record<string, FieldInfo>> {
  const out: Record<string, FieldInfo> = beamFields(system);
  for (const [field, q, formula] of SPECS) {
    out[field] = { unit: q === '1' ? '1' : UNIT_LABELS[system][q], formula };
  }
  return Object.freeze(out);
}

export const FIELDS: Record<UnitSystem, Readonly<Record<string, FieldInfo>>> = { SI: build('SI'), US: build('US') };
