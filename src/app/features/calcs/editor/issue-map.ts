import { featureTag } from '../../../../../shared/plots';
import type { AbstractControl } from '@angular/forms';
import type { CalcIssue } from '../../../../../shared/engine';

/** Engine issues by path (`segments[1].id`); several issues on one field are joined. */
export type IssueMap = Readonly<Record<string, string>>;

export function toIssueMap(issues: readonly CalcIssue[]): IssueMap {
  const out: Record<string, string> = {};
  for (const i of issues) out[i.path] = out[i.path] ? `${out[i.path]}; ${i.message}` : i.message;
  return out;
}

// The editor keeps a few fields under other names than the calc format (a key's Sy is `keySy`).
const RENAMES: Record<string, string> = { Sy: 'keySy' };

/** The form control an engine path names, or null (e.g. `torques` for the balance, `segments[0].material.E`). */
export function controlAt(form: AbstractControl, path: string): AbstractControl | null {
  const parts = path.replace(/\[(\d+)\]/g, '.$1').split('.').filter(Boolean);
  let c: AbstractControl | null = form;
  parts.forEach((p, k) => {
    const isFeatureSy = parts[0] === 'features' && k === parts.length - 1 && p in RENAMES;
    c = c?.get(isFeatureSy ? RENAMES[p] : p) ?? null;
  });
  // Only leaves take an error; a message about a whole row or list goes to the summary instead.
  return c && !('controls' in (c as object)) ? c : null;
}

/** Where an issue is, in words: "Segment 2", "Torque 1", "Material". */
// Field keys as the form labels them, so a message says "Torque 2, station", not "torques[1].at".
const FIELD_WORDS: Record<string, string> = {
  at: 'station', T: 'torque', Ta: 'alternating torque', power: 'power', speed: 'speed', length: 'length', od: 'outer ⌀', id: 'inner ⌀',
  r: 'radius', width: 'width', height: 'height', depth: 'depth', diameter: 'hole ⌀', Ma: 'alternating moment', Mm: 'midrange moment',
  Kt: 'Kt', Kts: 'Kts', Sy: 'yield strength', Su: 'ultimate strength', E: "Young's modulus", G: 'shear modulus', label: 'label',
  kind: 'kind', C: 'load rating C', X: 'X factor', Y: 'Y factor', Fx: 'axial force', Fy: 'force Fy', Fz: 'force Fz', mass: 'mass',
  pitchDiameter: 'pitch ⌀', pressureAngle: 'pressure angle', helixAngle: 'helix angle', pullFactor: 'pull factor', direction: 'direction',
};

/**
 * Where an input path sits, in the screen's words, counted from 1: "Segment 2, outer ⌀"; a feature by
 * the tag the screen and plots show (KS1, SF2) when its type is known.
 */
export function placeOf(path: string, featureTypes: readonly string[] = []): string {
  const m = /^(segments|torques|features|bending|supports|loads|masses)\[(\d+)\](?:\.(\w+))?/.exec(path);
  const names: Record<string, string> = {
    segments: 'Segment', torques: 'Torque', features: 'Feature', bending: 'Bending moment', supports: 'Bearing', loads: 'Force', masses: 'Mass',
  };
  if (m) {
    const index = Number(m[2]);
    const type = m[1] === 'features' ? featureTypes[index] : undefined;
    const where = type ? `Feature ${featureTag(type as Parameters<typeof featureTag>[0], index)}` : `${names[m[1]]} ${index + 1}`;
    return m[3] ? `${where}, ${FIELD_WORDS[m[3]] ?? m[3]}` : where;
  }
  const head = path.split(/[.[]/)[0];
  const words: Record<string, string> = {
    material: 'Material', fatigue: 'Fatigue', torques: 'Torques', segments: 'Segments', units: 'Units', '(input)': 'Calc input',
    notes: 'Notes', title: 'Heading', features: 'Features', bending: 'Bending moments',
    supports: 'Bearings', loads: 'Forces', masses: 'Masses', speed: 'Operating speed',
  };
  return words[head] ?? head;
}
