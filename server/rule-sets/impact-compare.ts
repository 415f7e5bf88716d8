import { evaluateValidInput, validateCalcInput, type CalcInput } from '../../shared/engine';
import { applyRuleSetMethods, evaluateChecklistSync, type RuleSet } from '../../shared/rules';
import { outcomeOf, type OutcomeSummary } from '../../shared/schemas/outcome';
import type { ImpactRow } from '../../shared/schemas/rule-set.schema';
import type { Calc, Project, Revision } from '../db/models';

/**
 * The outcome of a stored input under another version of its standard, as impact analysis and the
 * review-health signals judge it. An approved revision's input passed validation when it was signed
 * (signing needs a result), so the schema check is not repeated here; it is the costliest step per revision.
 * The synchronous evaluator gives the same rows as json-rules-engine (tested in shared/rules) at bulk speed.
 */
export function outcomeUnder(raw: unknown, doc: RuleSet): OutcomeSummary {
  try {
    const input = applyRuleSetMethods(raw as CalcInput, doc);
    return outcomeOf(evaluateChecklistSync(input, evaluateValidInput(input), doc));
  } catch {
    // Only input a newer engine no longer accepts gets here: validate it to say so.
    return { verdict: validateCalcInput(raw).ok ? 'error' : 'invalid-input', failing: [] };
  }
}

/** The outcome a revision was stored with (older rows kept only the verdict). */
export function storedOutcome(outcome: string | null, verdict: string | null): OutcomeSummary {
  return outcome ? JSON.parse(outcome) : { verdict, failing: [] };
}

/** An approved revision as the impact scan reads it: with its calc and the calc's project. */
export type ScannedRevision = Revision & { Calc: Calc & { Project: Project } };

/** A row when the verdict changes; the clauses behind it are the mandatory rows that flip. */
export function impactRowOf(revision: ScannedRevision, doc: RuleSet): ImpactRow | null {
  const before = storedOutcome(revision.outcome, revision.verdict);
  const after = outcomeUnder(JSON.parse(revision.input), doc);
  if (before.verdict === after.verdict) return null;
  const c = revision.Calc;
  return {
    calcId: c.id,
    revisionId: revision.id,
    projectCode: c.Project.code,
    number: c.number,
    title: c.title,
    revision: revision.label,
    approvedAt: revision.approvedAt ? revision.approvedAt.toISOString() : null,
    before: before.verdict,
    after: after.verdict,
    clauses: changedClauses(before, after, doc),
  };
}

/**
 * Mandatory rows that fail under one version but not under the other, each with its clause title
 * (from the new version where it exists there). Keys are "clause|location|status".
 */
export function changedClauses(before: OutcomeSummary, after: OutcomeSummary, doc: RuleSet): ImpactRow['clauses'] {
  const strip = (key: string) => key.split('|').slice(0, 2).join('|');
  const was = new Map(before.failing.map((k) => [strip(k), k.split('|')[2]]));
  const now = new Map(after.failing.map((k) => [strip(k), k.split('|')[2]]));
  const titles = new Map(doc.clauses.map((c) => [c.id, c.title]));
  return [...new Set([...was.keys(), ...now.keys()])]
    .filter((k) => was.has(k) !== now.has(k))
    .map((k) => {
      const [clauseId, location] = k.split('|');
      return {
        clauseId,
        location,
        title: titles.get(clauseId) ?? '(not in this version)',
        before: was.get(k) ?? 'pass',
        after: now.get(k) ?? 'pass',
      };
    });
}
