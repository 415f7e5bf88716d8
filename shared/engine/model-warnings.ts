import type { CalcIssue } from './issue-messages';
import { SIZE_RANGE_MM, TEMPERATURE_RANGE_F } from './marin';
import type { Mat, Model } from './model';
import { neuberInRange } from './notch-sensitivity';
import { formatNumber as f } from './number-format';
import { locate } from './shaft-geometry';
import { fromBase, toBase } from './units';

// Tabulated G may differ from E/(2(1+ν)) by about 1 % for steel (REFERENCES.md); 5 % suggests a typo.
const G_MISMATCH = 0.05;

function materialWarnings(m: Mat, model: Model, out: CalcIssue[]): void {
  if (m.nu !== undefined) {
    const iso = m.E / (2 * (1 + m.nu));
    if (Math.abs(m.G - iso) > G_MISMATCH * m.G) {
      out.push({ path: `${m.path}.G`, message: `G differs by ${f((100 * (m.G - iso)) / iso, 3)} % from E/(2(1+ν)); check the entry` });
    }
  }
  const usesNeuber = (model.input.features ?? []).length > 0;
  if (usesNeuber && (!neuberInRange(m.Su, 'bending') || !neuberInRange(m.Su, 'torsion'))) {
    out.push({ path: `${m.path}.Su`, message: 'Sut is outside the range of Shigley Eq. 6-35 (about 50–250 kpsi bending, '
      + '50–220 kpsi torsion); the nearest end of the range is used for the Neuber constant' });
  }
  if (m.kind !== 'steel' && (usesNeuber || (model.fatigue && model.fatigue.SePrime === null))) {
    out.push({ path: `${m.path}.kind`, message: `the Neuber constants of Eq. 6-35 and Se′ = 0.5·Sut are for steels; this material is ${m.kind}` });
  }
}

function fatigueWarnings(model: Model, out: CalcIssue[]): void {
  const fat = model.input.fatigue;
  if (!fat) return;
  if (fat.surfaceTable === '11th') {
    out.push({ path: 'fatigue.surfaceTable', message: 'the 11th-edition Table 6-2 coefficients are recalled from memory, not checked against a copy' });
  }
  if (fat.temperature !== undefined) {
    const tf = fromBase(toBase(fat.temperature, 'temperature', model.system), 'temperature', 'US');
    if (tf < TEMPERATURE_RANGE_F[0] || tf > TEMPERATURE_RANGE_F[1]) {
      out.push({ path: 'fatigue.temperature', message: 'outside 70–1000 °F (21–538 °C), the range of the kd polynomial; its nearest end is used' });
    }
  }
  for (const s of model.segs) {
    if (s.od < SIZE_RANGE_MM[0] || s.od > SIZE_RANGE_MM[1]) {
      out.push({ path: `segments[${s.index}].od`, message: 'outside 2.79–254 mm, the range of the size factor kb (Eq. 6-20); the formula is extended' });
    }
  }
}

function featureWarnings(model: Model, out: CalcIssue[]): void {
  (model.input.features ?? []).forEach((ft, i) => {
    if (ft.type !== 'shoulder-fillet' || (ft.Kt !== undefined && ft.Kts !== undefined)) return;
    const loc = locate(ft.at * model.k.length, model.bounds);
    if (model.segs[loc.left].id > 0 || model.segs[loc.right].id > 0) {
      out.push({ path: `features[${i}]`, message: 'the fillet fits are for solid shafts; a hollow shoulder needs a chart value' });
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
