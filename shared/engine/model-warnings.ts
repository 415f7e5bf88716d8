import type { CalcIssue } from './issue-messages';
import { SIZE_RANGE_MM, TEMPERATURE_NO_WARNING, TEMPERATURE_RANGE_F } from './marin';
import type { Mat, Model } from './model';
import { neuberInRange } from './notch-sensitivity';
import { formatNumber as f } from './number-format';
import { locate } from './shaft-geometry';
import { fromBase, toBase, UNIT_LABELS } from './units';

// Tabulated G may differ from E/(2(1+ν)) by about 1 % for steel (docs/references.md); 5 % suggests a typo.
const G_MISMATCH = 0.05;

/*
 * Beyond these a value fits no engineering material, and the usual cause is numbers typed in the
 * other unit system (E = 207 with units "US" reads 207 Mpsi). SI values; common practice, no
 * source: E from polymers (~1 GPa) to diamond (~1200 GPa), strengths from soft polymers to the
 * strongest wire (from memory).
 */
const MATERIAL_PLAUSIBLE: readonly [key: 'E' | 'G' | 'Sy' | 'Su', lo: number, hi: number, q: 'modulus' | 'stress'][] = [
  ['E', 1, 1200, 'modulus'],
  ['G', 0.3, 500, 'modulus'],
  ['Sy', 10, 3500, 'stress'],
  ['Su', 10, 3500, 'stress'],
];

function plausibilityWarnings(m: Mat, model: Model, out: CalcIssue[]): void {
  const s = model.system;
  for (const [key, lo, hi, q] of MATERIAL_PLAUSIBLE) {
    const value = fromBase(m[key], q, s);
    const [a, b] = [lo, hi].map((v) => fromBase(toBase(v, q, 'SI'), q, s));
    if (value >= a && value <= b) continue;
    out.push({
      path: `${m.path}.${key}`,
      message:
        `${key} = ${f(value)} ${UNIT_LABELS[s][q]} is far outside any engineering material ` +
        `(${f(a, 3)}–${f(b, 3)} ${UNIT_LABELS[s][q]}); check the value and that the calc's units ("${s}") are the ones it was typed in`,
    });
  }
}

function materialWarnings(m: Mat, model: Model, out: CalcIssue[]): void {
  plausibilityWarnings(m, model, out);
  if (m.nu !== undefined) {
    const iso = m.E / (2 * (1 + m.nu));
    if (Math.abs(m.G - iso) > G_MISMATCH * m.G) {
      out.push({
        path: `${m.path}.G`,
        message: `G differs by ${f((100 * (m.G - iso)) / iso, 3)} % from E/(2(1+ν)); check the entry`,
      });
    }
  }
  const usesNeuber = (model.input.features ?? []).length > 0;
  if (usesNeuber && (!neuberInRange(m.Su, 'bending') || !neuberInRange(m.Su, 'torsion'))) {
    out.push({
      path: `${m.path}.Su`,
      message:
        'Sut is outside the range of Shigley Eq. 6-35 (about 50–250 kpsi bending, ' +
        '50–220 kpsi torsion); the nearest end of the range is used for the Neuber constant',
    });
  }
  if (m.kind !== 'steel' && (usesNeuber || (model.fatigue && model.fatigue.SePrime === null))) {
    out.push({
      path: `${m.path}.kind`,
      message: `the Neuber constants of Eq. 6-35 and Se′ = 0.5·Sut are for steels; this material is ${m.kind}`,
    });
  }
}

function fatigueWarnings(model: Model, out: CalcIssue[]): void {
  const fat = model.input.fatigue;
  if (!fat) return;
  if (fat.surfaceTable === '11th') {
    out.push({
      path: 'fatigue.surfaceTable',
      message: 'the 11th-edition Table 6-2 coefficients are recalled from memory, not checked against a copy',
    });
  }
  if (fat.temperature !== undefined) {
    // Compared in the entered unit, so 20 °C and 68 °F (room temperature) are not lost to rounding.
    const [lo, hi] = TEMPERATURE_NO_WARNING[model.system];
    if (fat.temperature < lo || fat.temperature > hi) {
      out.push({
        path: 'fatigue.temperature',
        message:
          `outside ${TEMPERATURE_NO_WARNING.SI.join('–')} °C (${TEMPERATURE_NO_WARNING.US.join('–')} °F), ` +
          `room temperature to the top of the kd polynomial (${TEMPERATURE_RANGE_F.join('–')} °F); its nearest end is used`,
      });
    }
  }
  // Shigley 9th §6-9 and §7-4: kc = 1 when bending and torsion are combined into a von Mises stress.
  if (fat.kc !== undefined && fat.kc !== 1) {
    out.push({
      path: 'fatigue.kc',
      message:
        `kc = ${f(fat.kc)} reduces Se, but this engine already combines torsion into the von Mises ` +
        'stresses σ′a, σ′m (Shigley 9th §7-4, where kc = 1): torsion would be counted twice; use kc = 1 unless the factor is for something else',
    });
  }
  for (const s of model.segs) {
    if (s.od < SIZE_RANGE_MM[0] || s.od > SIZE_RANGE_MM[1]) {
      out.push({
        path: `segments[${s.index}].od`,
        message: 'outside 2.79–254 mm, the range of the size factor kb (Eq. 6-20); the formula is extended',
      });
    }
  }
}

function featureWarnings(model: Model, out: CalcIssue[]): void {
  (model.input.features ?? []).forEach((ft, i) => {
    if (ft.type !== 'shoulder-fillet' || (ft.Kt !== undefined && ft.Kts !== undefined)) return;
    const loc = locate(ft.at * model.k.length, model.bounds);
    if (model.segs[loc.left].id > 0 || model.segs[loc.right].id > 0) {
      out.push({
        path: `features[${i}]`,
        message: 'the fillet fits are for solid shafts; a hollow shoulder needs a chart value',
      });
    }
  });
}

/** Non-fatal notes: methods used at the edge of their range or on a material they were not fitted to. */
export function modelWarnings(model: Model): void {
  const mats = new Set(model.segs.map((s) => s.mat));
  for (const m of mats) materialWarnings(m, model, model.warnings);
  fatigueWarnings(model, model.warnings);
  featureWarnings(model, model.warnings);
}
