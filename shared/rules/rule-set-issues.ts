import type { core } from 'zod';

export interface RuleSetIssue {
  path: string;
  message: string;
}

/** `clauses[3].check.all[0].fact` from a path array. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) out += typeof key === 'number' ? `[${key}]` : out ? `.${String(key)}` : String(key);
  return out || '(document)';
}

function describe(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (typeof v === 'string') return `the text ${JSON.stringify(v.slice(0, 40))}`;
  if (Array.isArray(v)) return 'a list';
  return typeof v === 'object' ? 'an object' : String(v);
}

/*
 * How far a union branch is from what the author wrote: a wrong type or foreign keys at its root
 * rule it out; a branch whose only complaints are missing fields is a weaker match than one that
 * recognised the fields present. Ties go to the branch with fewer issues.
 */
function distance(branch: readonly core.$ZodIssue[]): number {
  if (branch.some((i) => i.path.length === 0 && (i.code === 'unrecognized_keys' || i.code === 'invalid_type')))
    return 2;
  return branch.every((i) => i.code === 'invalid_type' && i.input === undefined) ? 1 : 0;
}

function meantBranch(issue: core.$ZodIssueInvalidUnion): readonly core.$ZodIssue[] | null {
  const input = (issue as { input?: unknown }).input;
  if (input && typeof input === 'object' && Object.keys(input).length === 0) return null;
  const ranked = issue.errors
    .map((b) => [distance(b), b.length, b] as const)
    .sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  return ranked.length && ranked[0][0] < 2 ? ranked[0][2] : null;
}

function unionMessage(path: readonly PropertyKey[]): string {
  return path[path.length - 1] === 'value'
    ? 'must be a number, text, true/false, null, a list of those, or { "fact": … } naming a fact or parameter'
    : 'must be a condition: { "all": [...] }, { "any": [...] }, { "not": {...} } or { "fact", "operator", "value" }';
}

function single(issue: core.$ZodIssue, path: PropertyKey[]): string {
  switch (issue.code) {
    case 'invalid_type':
      return issue.input === undefined
        ? `is missing (expected ${issue.expected})`
        : `must be ${issue.expected === 'int' ? 'an integer' : `a ${issue.expected}`}, got ${describe(issue.input)}`;
    case 'invalid_value':
      return `must be one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}, got ${describe(issue.input)}`;
    case 'too_small':
    case 'too_big': {
      const small = issue.code === 'too_small';
      const what = issue.origin === 'array' ? ' entries' : issue.origin === 'string' ? ' characters' : '';
      return `must have ${small ? 'at least' : 'at most'} ${String(small ? issue.minimum : issue.maximum)}${what}`;
    }
    case 'invalid_format':
      return issue.format === 'regex' ? issue.message : `must be a valid ${issue.format}, got ${describe(issue.input)}`;
    default:
      return `${issue.message} (${formatPath(path)})`;
  }
}

/** zod issues as `{ path, message }`; for a union, only the branch the author evidently meant. */
export function toRuleSetIssues(
  issues: readonly core.$ZodIssue[],
  prefix: readonly PropertyKey[] = [],
): RuleSetIssue[] {
  const out: RuleSetIssue[] = [];
  for (const issue of issues) {
    const path = [...prefix, ...issue.path];
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) out.push({ path: formatPath([...path, key]), message: `unknown field "${key}"` });
    } else if (issue.code === 'invalid_union' && issue.errors.length > 0) {
      const meant = meantBranch(issue);
      const isMissing = issue.errors.every((b) =>
        b.every((i) => i.path.length === 0 && i.code === 'invalid_type' && i.input === undefined),
      );
      if (meant) out.push(...toRuleSetIssues(meant, path));
      else
        out.push({
          path: formatPath(path),
          message: isMissing ? `is missing; it ${unionMessage(path)}` : unionMessage(path),
        });
    } else {
      out.push({ path: formatPath(path), message: single(issue, path) });
    }
  }
  return out;
}
