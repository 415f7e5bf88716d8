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
  const parts = path
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .filter(Boolean);
  let c: AbstractControl | null = form;
  parts.forEach((p, k) => {
    const isFeatureSy = parts[0] === 'features' && k === parts.length - 1 && p in RENAMES;
    c = c?.get(isFeatureSy ? RENAMES[p] : p) ?? null;
  });
  // Only leaves take an error; a message about a whole row or list goes to the summary instead.
  return c && !('controls' in (c as object)) ? c : null;
}

// Where an issue is, in the screen's words: one mapping shared with the server's messages.
export { placeOf } from '../../../../../shared/engine/field-places';
