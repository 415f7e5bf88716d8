import { checkBeam } from './beam/check-beam';
import { checkFeatures } from './check-features';
import { checkGeometry } from './check-geometry';
import { checkLoads } from './check-loads';
import { checkRanges } from './check-ranges';
import { toCalcIssues, type CalcIssue } from './issue-messages';
import { calcInputSchema, type CalcInput } from './schema';
import type { UnitSystem } from './units';

export type ValidationResult = { ok: true; value: CalcInput } | { ok: false; issues: CalcIssue[] };

/** Thrown by evaluateShaft on invalid input; `issues` name each field path and the reason. */
export class CalcInputError extends Error {
  readonly issues: CalcIssue[];

  constructor(issues: CalcIssue[]) {
    super(`invalid calc input: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`);
    this.name = 'CalcInputError';
    this.issues = issues;
  }
}

function systemOf(input: unknown): UnitSystem | null {
  const units = input && typeof input === 'object' ? (input as { units?: unknown }).units : undefined;
  return units === 'SI' || units === 'US' ? units : null;
}

/**
 * Checks a calc input against the v1 schema, then the plausible range of each quantity
 * (check-ranges.ts), then the rules between fields (inner below outer
 * diameter, stations on the shaft, balanced torques, fillet within its step, sources for entered
 * factors). Never throws; every issue names its field path, the value with its unit and the reason.
 */
export function validateCalcInput(input: unknown): ValidationResult {
  if (input === null || typeof input !== 'object' || Array.isArray(input)) {
    return { ok: false, issues: [{ path: '(input)', message: 'a calc input must be a JSON object' }] };
  }
  // Parsing with options (reportInput) measured about twice as slow, so valid input, the common
  // case, is parsed bare; only a failure is parsed again keeping the inputs for the messages.
  const parsed = calcInputSchema.safeParse(input);
  if (!parsed.success) {
    const detailed = calcInputSchema.safeParse(input, { reportInput: true });
    return { ok: false, issues: toCalcIssues(detailed.error?.issues ?? parsed.error.issues, systemOf(input)) };
  }
  // Ranges first: the cross-field checks do arithmetic (sums of torques, T = P/ω) that an
  // implausible magnitude could overflow into a meaningless message.
  const ranges = checkRanges(parsed.data);
  if (ranges.length) return { ok: false, issues: ranges };
  const issues = [
    ...checkGeometry(parsed.data),
    ...checkLoads(parsed.data),
    ...checkFeatures(parsed.data),
    ...checkBeam(parsed.data),
  ];
  return issues.length ? { ok: false, issues } : { ok: true, value: parsed.data };
}
