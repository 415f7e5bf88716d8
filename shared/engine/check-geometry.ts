import type { CalcIssue } from './issue-messages';
import { formatNumber as f } from './number-format';
import type { CalcInput, MaterialInput } from './schema';
import { UNIT_LABELS } from './units';

function checkMaterial(m: MaterialInput, path: string, stress: string, out: CalcIssue[]): void {
  if (m.Sy > m.Su) {
    out.push({
      path: `${path}.Sy`,
      message: `yield strength ${f(m.Sy)} ${stress} exceeds ultimate strength ${f(m.Su)} ${stress}`,
    });
  }
}

/** Cross-field checks on the shaft's geometry, materials and fatigue settings. */
export function checkGeometry(input: CalcInput): CalcIssue[] {
  const out: CalcIssue[] = [];
  const u = UNIT_LABELS[input.units];
  checkMaterial(input.material, 'material', u.stress, out);
  input.segments.forEach((s, i) => {
    if (s.id >= s.od) {
      out.push({
        path: `segments[${i}].id`,
        message: `inner diameter ${f(s.id)} ${u.length} is not smaller than outer diameter ${f(s.od)} ${u.length}`,
      });
    }
    if (s.material) checkMaterial(s.material, `segments[${i}].material`, u.stress, out);
  });
  const fat = input.fatigue;
  if (fat?.kd !== undefined && fat.temperature !== undefined) {
    out.push({ path: 'fatigue.kd', message: 'give either kd or temperature, not both' });
  }
  if (fat?.SePrime !== undefined && !fat.SePrimeSource) {
    out.push({ path: 'fatigue.SePrimeSource', message: 'an entered endurance limit SePrime needs its source' });
  }
  return out;
}
