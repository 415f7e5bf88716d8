import { z } from 'zod';

/*
 * zod's own messages ("Too big: expected string to have <=100 characters") read like a parser's,
 * not like the form's. Every schema here that a person can get wrong carries its own words; this
 * catches the rest, so a refusal always reads as a sentence about the field ("is at most 100
 * characters"). Installed once where parsing starts (the server app and the calc command).
 */
type Issue = Parameters<NonNullable<NonNullable<Parameters<typeof z.config>[0]>['customError']>>[0];

const UNIT: Record<string, string> = { string: 'characters', array: 'entries', set: 'entries', file: 'bytes' };

function bound(issue: Issue & { origin?: string; inclusive?: boolean }, limit: unknown, side: 'most' | 'least') {
  const unit = issue.origin ? UNIT[issue.origin] : undefined;
  if (unit) return `is at ${side} ${String(limit)} ${unit}`;
  const word = side === 'most' ? (issue.inclusive ? 'at most' : 'below') : issue.inclusive ? 'at least' : 'above';
  return `must be ${word} ${String(limit)}`;
}

export function plainWords(issue: Issue): string | undefined {
  switch (issue.code) {
    case 'too_big':
      return bound(issue, issue.maximum, 'most');
    case 'too_small':
      if (issue.origin === 'string' && issue.minimum === 1) return 'is required';
      return bound(issue, issue.minimum, 'least');
    case 'invalid_type':
      if (issue.input === undefined) return 'is required';
      if (issue.expected === 'int')
        return typeof issue.input === 'number' ? 'must be a whole number' : 'must be a number';
      if (issue.expected === 'number') return 'must be a number';
      return `must be ${/^[aeiou]/.test(issue.expected) ? 'an' : 'a'} ${issue.expected}`;
    case 'not_multiple_of':
      return `must be a multiple of ${String(issue.divisor)}`;
    case 'invalid_value':
      return `must be one of: ${issue.values.map(String).join(', ')}`;
    case 'unrecognized_keys':
      return `has fields this form does not have: ${issue.keys.join(', ')}`;
    default:
      return undefined;
  }
}

let installed = false;
export function installPlainWords(): void {
  if (installed) return;
  installed = true;
  z.config({ customError: plainWords });
}
