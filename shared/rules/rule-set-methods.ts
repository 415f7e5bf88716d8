import type { CalcInput, CalcResult } from '../engine';
import type { RuleSet, RuleSetMethods } from './rule-set-schema';

export interface MethodIssue {
  path: string;
  message: string;
}

export interface MethodsUsed {
  /** The rule set's choices. */
  requested: RuleSetMethods;
  /** What the evaluated calc actually used; null where the calc has no fatigue data. */
  surfaceTable: string | null;
  kfOnMidrange: boolean | null;
  reliability: number | null;
  fatigueCriterion: RuleSetMethods['fatigueCriterion'];
  /** Per shoulder fillet, the method text the engine reports for Kt and Kts. */
  fillets: { index: number; Kt: string; Kts: string }[];
}

/**
 * The calc with the rule set's method choices imposed on it (the fillet Kts fit, Shigley Table 6-2 edition, Kf on
 * midrange stresses, reliability when the standard fixes one). Evaluate this, not the author's
 * input, so the result and its checklist record the methods the standard requires. Pure.
 */
export function applyRuleSetMethods(input: CalcInput, ruleSet: RuleSet): CalcInput {
  const m = ruleSet.methods;
  // The fillet Kts fit is the engine's to apply; "author" for Kt can only be checked, not imposed.
  const withFillets: CalcInput = { ...input, methods: { ...input.methods, filletKts: m.filletKts } };
  if (!input.fatigue) return withFillets;
  const fatigue = { ...input.fatigue, surfaceTable: m.surfaceTable, kfOnMidrange: m.kfOnMidrange };
  if (m.reliability !== undefined) fatigue.reliability = m.reliability;
  return { ...withFillets, fatigue };
}

function filletIssue(index: number, what: 'Kt' | 'Kts', method: string, wanted: string): MethodIssue | null {
  // The engine names its published fits in the method text; an author-entered value always conforms
  // (the entered-factor clauses judge it), except that "author" demands one.
  if (method.startsWith('entered by the author')) return null;
  const ok = wanted === 'author' ? false : new RegExp(wanted, 'i').test(method);
  if (ok) return null;
  const need =
    wanted === 'author'
      ? 'a chart value entered by the author'
      : `the ${wanted === 'peterson' ? 'Peterson' : 'Norton'} fit`;
  return {
    path: `features[${index}].${what}`,
    message: `the rule set requires ${need} for ${what} at shoulder fillets; the engine used: ${method}`,
  };
}

function fatigueIssues(input: CalcInput, m: RuleSetMethods): MethodIssue[] {
  const f = input.fatigue;
  if (!f) return [];
  const out: MethodIssue[] = [];
  const hint = 'evaluate the calc after applyRuleSetMethods';
  if ((f.surfaceTable ?? '9th-10th') !== m.surfaceTable)
    out.push({
      path: 'fatigue.surfaceTable',
      message: `the calc used Table 6-2 ${f.surfaceTable ?? '9th-10th'}, the rule set requires ${m.surfaceTable}; ${hint}`,
    });
  if ((f.kfOnMidrange ?? true) !== m.kfOnMidrange)
    out.push({
      path: 'fatigue.kfOnMidrange',
      message: `the rule set requires kfOnMidrange ${m.kfOnMidrange}; ${hint}`,
    });
  if (m.reliability !== undefined && (f.reliability ?? 50) !== m.reliability) {
    out.push({
      path: 'fatigue.reliability',
      message: `the rule set requires ${m.reliability} % reliability, the calc used ${f.reliability ?? 50} %; ${hint}`,
    });
  }
  return out;
}

/** Which methods the evaluation used, and where they differ from the rule set's choices. */
export function methodsUsed(
  input: CalcInput,
  result: CalcResult,
  ruleSet: RuleSet,
): { used: MethodsUsed; issues: MethodIssue[] } {
  const m = ruleSet.methods;
  const f = input.fatigue;
  const fillets = result.features
    .filter((x) => x.type === 'shoulder-fillet')
    .map((x) => ({ index: x.index, Kt: x.method.Kt, Kts: x.method.Kts }));
  const issues = fatigueIssues(input, m);
  for (const x of fillets) {
    for (const issue of [filletIssue(x.index, 'Kt', x.Kt, m.filletKt), filletIssue(x.index, 'Kts', x.Kts, m.filletKts)])
      if (issue) issues.push(issue);
  }
  const used: MethodsUsed = {
    requested: m,
    surfaceTable: f ? (f.surfaceTable ?? '9th-10th') : null,
    kfOnMidrange: f ? (f.kfOnMidrange ?? true) : null,
    reliability: f ? (f.reliability ?? 50) : null,
    fatigueCriterion: m.fatigueCriterion,
    fillets,
  };
  return { used, issues };
}
