import { evaluateValidInput, validateCalcInput, type CalcInput } from '../engine';
import { evaluateChecklistSync } from './checklist';
import type { ChecklistRow } from './checklist-types';
import { applyRuleSetMethods } from './rule-set-methods';
import type { RuleSet } from './rule-set-schema';

export interface GoverningRow {
  clauseId: string;
  reference: string;
  clauseTitle: string;
  location: string;
  status: ChecklistRow['status'];
  utilisation: number | null;
  message: string;
}

/** Whether one trial diameter passes, and the row that governs it. */
export interface Trial {
  passes: boolean;
  governing: GoverningRow | null;
}

function governingOf(rows: ChecklistRow[]): GoverningRow | null {
  const bad = rows.filter((r) => r.status === 'fail' || r.status === 'error');
  const pool = bad.length ? bad : rows.filter((r) => r.status === 'pass');
  const top = pool.reduce<ChecklistRow | null>(
    (best, r) => (best === null || (r.utilisation ?? 0) > (best.utilisation ?? 0) ? r : best),
    null,
  );
  return (
    top && {
      clauseId: top.clauseId,
      reference: top.reference,
      clauseTitle: top.clauseTitle,
      location: top.location.label,
      status: top.status,
      utilisation: top.utilisation,
      message: top.message,
    }
  );
}

/*
 * One trial diameter: the segment resized (the bore scaled with it), validated, evaluated with the
 * rule set's methods and checked synchronously. Only mandatory rows that the segment can influence
 * count: the shaft's, its own and those of features on it or at its ends. Invalid geometry (a fillet
 * larger than the step, a groove through the wall) fails the trial with the reason.
 */
export function trial(input: CalcInput, ruleSet: RuleSet, index: number, od: number): Trial {
  const seg = input.segments[index];
  const segments = input.segments.map((s, i) => (i === index ? { ...s, od, id: (seg.id / seg.od) * od } : s));
  const checked = validateCalcInput({ ...input, segments });
  if (!checked.ok) {
    const { path, message } = checked.issues[0];
    return {
      passes: false,
      governing: {
        clauseId: '',
        reference: '',
        clauseTitle: 'calc input invalid at this diameter',
        location: path,
        status: 'error',
        utilisation: null,
        message,
      },
    };
  }
  const effective = applyRuleSetMethods(checked.value, ruleSet);
  const result = evaluateValidInput(effective);
  const [start, end] = [result.segments[index].start, result.segments[index].end];
  const influenced = (r: ChecklistRow): boolean =>
    r.location.scope === 'shaft' ||
    (r.location.scope === 'segment' && r.location.index === index) ||
    (r.location.scope === 'feature' && r.location.at !== null && r.location.at >= start && r.location.at <= end);
  const rows = evaluateChecklistSync(effective, result, ruleSet).rows.filter(
    (r) => r.severity === 'mandatory' && influenced(r),
  );
  return {
    passes: rows.every((r) => r.status === 'pass' || r.status === 'not-applicable'),
    governing: governingOf(rows),
  };
}
