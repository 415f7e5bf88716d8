import { isFactCondition, isFactRef, PARAM_PREFIX, type Condition, type TopCondition } from './condition-schema';
import { checkCondition, checkMeasure } from './condition-check';
import type { CheckContext } from './fact-types';
import { toRuleSetIssues, type RuleSetIssue } from './rule-set-issues';
import { ruleSetSchema, type Clause, type Parameter, type RuleSet } from './rule-set-schema';

export type RuleSetValidation = { ok: true; value: RuleSet } | { ok: false; issues: RuleSetIssue[] };

function duplicates<T>(
  list: readonly T[],
  key: (x: T) => string,
  at: (i: number) => string,
  what: string,
  out: RuleSetIssue[],
): void {
  const first = new Map<string, number>();
  list.forEach((x, i) => {
    const k = key(x);
    const j = first.get(k);
    if (j === undefined) first.set(k, i);
    else out.push({ path: at(i), message: `duplicate ${what} "${k}" (also ${at(j).replace(/\.\w+$/, '')})` });
  });
}

function checkParameters(params: readonly Parameter[], out: RuleSetIssue[]): void {
  params.forEach((p, i) => {
    if (typeof p.value === 'number' && !p.unit)
      out.push({
        path: `parameters[${i}].unit`,
        message: `numeric parameter "${p.name}" needs its SI unit ("1" if dimensionless)`,
      });
    if (typeof p.value !== 'number' && p.unit)
      out.push({ path: `parameters[${i}].unit`, message: `parameter "${p.name}" is not a number and takes no unit` });
  });
}

function paramsIn(c: Condition | TopCondition, out: Set<string>): Set<string> {
  if ('all' in c) c.all.forEach((x) => paramsIn(x, out));
  else if ('any' in c) c.any.forEach((x) => paramsIn(x, out));
  else if ('not' in c) paramsIn(c.not, out);
  else if (isFactCondition(c)) {
    for (const name of [c.fact, isFactRef(c.value) ? c.value.fact : ''])
      if (name.startsWith(PARAM_PREFIX)) out.add(name.slice(PARAM_PREFIX.length));
  }
  return out;
}

/** Names of the parameters a clause's check and measure use (applicability only selects where). */
export function clauseParameters(clause: Clause): string[] {
  const used = paramsIn(clause.check, new Set<string>());
  if (clause.measure?.limit.startsWith(PARAM_PREFIX)) used.add(clause.measure.limit.slice(PARAM_PREFIX.length));
  return [...used];
}

// Each numeric limit must say where it comes from, in the words people read: the clause text.
function checkOrigins(clause: Clause, i: number, params: ReadonlyMap<string, Parameter>, out: RuleSetIssue[]): void {
  const text = clause.text.toLowerCase();
  for (const name of clauseParameters(clause)) {
    const p = params.get(name);
    if (p && typeof p.value === 'number' && !text.includes(p.origin.toLowerCase())) {
      out.push({
        path: `clauses[${i}].text`,
        message: `name the origin of parameter "${name}" in the clause text: "${p.origin}"`,
      });
    }
  }
}

function semanticIssues(doc: RuleSet): RuleSetIssue[] {
  const out: RuleSetIssue[] = [];
  duplicates(
    doc.parameters,
    (p) => p.name,
    (i) => `parameters[${i}].name`,
    'parameter',
    out,
  );
  duplicates(
    doc.clauses,
    (c) => c.id,
    (i) => `clauses[${i}].id`,
    'clause id',
    out,
  );
  duplicates(
    doc.manualItems,
    (m) => m.id,
    (i) => `manualItems[${i}].id`,
    'manual item id',
    out,
  );
  checkParameters(doc.parameters, out);
  if (doc.status !== 'draft' && doc.effectiveDate === null) {
    out.push({ path: 'effectiveDate', message: `a rule set with status ${doc.status} needs its effective date` });
  }
  const params = new Map(doc.parameters.map((p) => [p.name, p]));
  doc.clauses.forEach((clause, i) => {
    const ctx: CheckContext = { scope: clause.scope, params, out };
    checkCondition(clause.applicability, `clauses[${i}].applicability`, ctx);
    checkCondition(clause.check, `clauses[${i}].check`, ctx);
    checkMeasure(clause, `clauses[${i}].measure`, ctx);
    checkOrigins(clause, i, params, out);
  });
  return out;
}

/**
 * Checks a rule-set document (any unknown value, e.g. parsed JSON): the format, then unknown facts
 * for each clause's scope, unknown or mistyped parameters, units, duplicate ids and the origin of
 * each limit. Never throws; each issue names its place, e.g.
 * `clauses[3].check.all[0].fact: unknown fact "tauMaxx" for scope segment`.
 */
export function validateRuleSet(doc: unknown): RuleSetValidation {
  if (doc === null || typeof doc !== 'object' || Array.isArray(doc)) {
    return { ok: false, issues: [{ path: '(document)', message: 'a rule set must be a JSON object' }] };
  }
  const parsed = ruleSetSchema.safeParse(doc);
  if (!parsed.success) {
    // Parsed again with inputs kept: the messages quote what was written.
    const detailed = ruleSetSchema.safeParse(doc, { reportInput: true });
    return { ok: false, issues: toRuleSetIssues(detailed.error?.issues ?? parsed.error.issues) };
  }
  const issues = semanticIssues(parsed.data);
  return issues.length ? { ok: false, issues } : { ok: true, value: parsed.data };
}
