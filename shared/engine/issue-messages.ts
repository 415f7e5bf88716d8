import type { core } from 'zod';
import { fieldOf } from './issue-fields';
import { formatNumber, formatPath } from './number-format';
import type { UnitSystem } from './units';

export interface CalcIssue {
  path: string;
  message: string;
}

function describeInput(input: unknown, unit: string): string {
  if (typeof input === 'number') return `${formatNumber(input)}${unit}`;
  if (typeof input === 'string') {
    // A decimal comma is refused, never guessed: "1,500" could be one and a half or fifteen hundred.
    const comma = /^\s*[+-]?\d*,\d+\s*$/.test(input)
      ? `; write it with a decimal point (${input.trim().replace(',', '.')}), commas are not read as numbers`
      : '';
    return `the text ${JSON.stringify(input.slice(0, 40))}${comma}`;
  }
  if (input === null) return 'null';
  return Array.isArray(input) ? 'a list' : typeof input === 'object' ? 'an object' : String(input);
}

// A discriminated union reports the whole object as input; the author wants to see the bad tag.
function discriminatorValue(input: unknown, path: readonly PropertyKey[]): unknown {
  const key = path[path.length - 1];
  return input && typeof input === 'object' && typeof key === 'string'
    ? (input as Record<string, unknown>)[key]
    : input;
}

function optionsOf(issue: core.$ZodIssueInvalidUnion): readonly unknown[] {
  return 'options' in issue && issue.options ? issue.options : [];
}

function typeMessage(issue: core.$ZodIssueInvalidType, name: string, unit: string): string {
  const expected =
    issue.expected === 'number'
      ? `a number${unit ? ` in${unit}` : ''}`
      : issue.expected === 'array'
        ? 'a list'
        : issue.expected === 'object'
          ? 'an object'
          : `a ${issue.expected}`;
  if (issue.input === undefined) return `${name} is missing (${expected})`;
  return `${name} must be ${expected}, got ${describeInput(issue.input, '')}`;
}

function boundMessage(issue: core.$ZodIssueTooSmall | core.$ZodIssueTooBig, name: string, unit: string): string {
  const small = issue.code === 'too_small';
  const limit = Number(small ? issue.minimum : issue.maximum);
  if (issue.origin === 'array')
    return `${name} needs ${small ? 'at least' : 'at most'} ${limit} ${limit === 1 ? 'entry' : 'entries'}`;
  if (issue.origin === 'string') return `${name} must be ${small ? 'at least' : 'at most'} ${limit} characters`;
  const words = small ? (issue.inclusive ? 'at least' : 'greater than') : issue.inclusive ? 'at most' : 'less than';
  return `${name} must be ${words} ${formatNumber(limit)}${unit}, got ${describeInput(issue.input, unit)}`;
}

// A union reports every branch; the branch with the fewest problems is the one the author meant.
function closestBranch(issue: core.$ZodIssueInvalidUnion): core.$ZodIssue[] {
  let best = issue.errors[0] ?? [];
  for (const branch of issue.errors) if (branch.length < best.length) best = branch;
  return best;
}

/** Turns zod issues into `{ path, message }` pairs that name the field, its unit and the reason. */
export function toCalcIssues(
  issues: readonly core.$ZodIssue[],
  system: UnitSystem | null,
  prefix: readonly PropertyKey[] = [],
): CalcIssue[] {
  const out: CalcIssue[] = [];
  for (const issue of issues) {
    const path = [...prefix, ...issue.path];
    if (issue.code === 'invalid_union' && issue.errors.length > 0) {
      out.push(...toCalcIssues(closestBranch(issue), system, path));
    } else if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        out.push({ path: formatPath([...path, key]), message: `unknown field "${key}" (check the spelling)` });
      }
    } else {
      out.push({ path: formatPath(path), message: messageFor(issue, path, system) });
    }
  }
  return out;
}

function messageFor(issue: core.$ZodIssue, path: readonly PropertyKey[], system: UnitSystem | null): string {
  const { name, unit } = fieldOf(path, system);
  switch (issue.code) {
    case 'invalid_type':
      return typeMessage(issue, name, unit);
    case 'too_small':
    case 'too_big':
      return boundMessage(issue, name, unit);
    case 'invalid_value':
      return (
        `${name} must be one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}, ` +
        `got ${describeInput(issue.input, '')}`
      );
    case 'invalid_union':
      return (
        `${name} must be one of ${optionsOf(issue)
          .map((v) => JSON.stringify(v))
          .join(', ')}` + `, got ${describeInput(discriminatorValue(issue.input, path), '')}`
      );
    default:
      return `${name}: ${issue.message}`;
  }
}
