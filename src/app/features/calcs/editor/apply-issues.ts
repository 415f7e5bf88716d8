import type { AbstractControl } from '@angular/forms';
import type { CalcIssue } from '../../../../../shared/engine';
import type { EditorForm } from './editor-form';
import { controlAt } from './issue-map';

// Controls that carry an engine message, per form, so the next round can clear them.
const marked = new WeakMap<EditorForm, Set<AbstractControl>>();

/**
 * Puts each engine issue on the control its path names (`segments[1].id`), so the field shows the
 * message and is announced as invalid; issues without a field stay in the summary list only.
 */
export function applyIssues(form: EditorForm, issues: readonly CalcIssue[]): void {
  const before = marked.get(form) ?? new Set<AbstractControl>();
  const now = new Map<AbstractControl, string>();
  for (const issue of issues) {
    const c = controlAt(form, issue.path);
    if (c) now.set(c, now.has(c) ? `${now.get(c)}; ${issue.message}` : issue.message);
  }
  for (const c of before) if (!now.has(c)) c.setErrors(null);
  for (const [c, message] of now) c.setErrors({ engine: message });
  marked.set(form, new Set(now.keys()));
}
