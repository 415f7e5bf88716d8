import { ENDURANCE_METHOD } from './endurance';
import { NEUBER_METHOD } from './notch-sensitivity';
import { POWER_METHOD } from './power';
import { J_FORMULA } from './section';
import { TRESCA_FORMULA, VON_MISES_FORMULA } from './combined';
import { BEAM_METHOD } from './beam/beam-method';
import { LIFE_METHOD } from './beam/bearing-life';
import { CRITICAL_SPEED_METHOD } from './beam/critical-speed';
import { BELT_METHOD, GEAR_METHOD } from './beam/resolve-loads';

/** The methods behind the whole result, for the report's method list (per-feature factors name their own). */
export const METHODS: Readonly<Record<string, string>> = Object.freeze({
  section: `${J_FORMULA}; τ(ρ) = T·ρ/J; γ = τ/G`,
  twist: 'φ = Σ Tᵢ·Lᵢ/(Gᵢ·Jᵢ) over the pieces of the torque diagram',
  torqueDiagram:
    "internal torque T = −Σ external torques left of the section (positive along +x on the left part's cut face, " +
    'right-hand rule); a torque at a station acts to its right; twist φ(b) − φ(a) = ∫ T/(G·J) dx, right-hand rotation about +x',
  bending:
    'beam model moment M (rotating shaft: Ma = M, Mm = 0, Shigley 9th §7-4) plus any entered Ma, Mm added on top as magnitudes; ' +
    'entered moments are linear between their stations and held constant beyond the first and last entry',
  beam: BEAM_METHOD,
  gearForces: GEAR_METHOD,
  beltForces: BELT_METHOD,
  bearingLife: LIFE_METHOD,
  criticalSpeed: CRITICAL_SPEED_METHOD,
  power: POWER_METHOD,
  notchSensitivity: NEUBER_METHOD,
  endurance: ENDURANCE_METHOD,
  staticVonMises: VON_MISES_FORMULA,
  staticTresca: TRESCA_FORMULA,
  fatigue:
    'DE-Goodman, DE-ASME-elliptic, DE-Gerber, DE-Soderberg on von Mises σ′a, σ′m (Shigley 9th §7-4); kc = 1 as stresses are combined',
  segmentStresses: 'plain section, no stress concentration; worst of the piece ends and bending stations',
  featureStresses: 'Kf, Kfs on nominal stresses at the station; the larger torque side where it jumps',
});

/** How each method above is named on screens and in reports: the words an engineer would write, not code keys. */
export const METHOD_NAMES: Readonly<Record<string, string>> = Object.freeze({
  section: 'Section properties',
  twist: 'Angle of twist',
  torqueDiagram: 'Torque diagram',
  bending: 'Bending moments',
  power: 'Torque from power and speed',
  notchSensitivity: 'Notch sensitivity q',
  endurance: 'Endurance limit Se',
  staticVonMises: 'Static check, von Mises',
  staticTresca: 'Static check, Tresca (maximum shear)',
  fatigue: 'Fatigue criteria',
  segmentStresses: 'Stresses in plain segments',
  featureStresses: 'Stresses at features',
});

/** Result fields printed with their formula, by name. */
export const FIELD_NAMES: Readonly<Record<string, string>> = Object.freeze({
  J: 'Polar second moment J',
  tauMax: 'Largest shear stress τmax',
  twist: 'Twist φ',
  Kf: 'Fatigue notch factor Kf',
  Se: 'Endurance limit Se',
  goodman: 'Fatigue safety, DE-Goodman',
});

/** The published method behind Kts at shoulder fillets, as a reader would cite it. */
export const FILLET_KTS_NAMES: Readonly<Record<string, string>> = Object.freeze({
  peterson: 'Peterson torsion polynomial (Pilkey & Pilkey, 3rd ed.)',
  norton: 'Norton power-law fit (Machine Design, 2nd ed., App. E)',
});
