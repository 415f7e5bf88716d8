// Batch command: evaluates shaft calc inputs (a file, "-" for standard input, or every *.json in a folder).
// Exit status: 0 all valid, 2 any invalid input (messages on stderr), 1 usage or file errors.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import {
  CalcInputError,
  evaluateValidInput,
  formatResultTable,
  validateCalcInput,
  type CalcIssue,
  type CalcResult,
} from '../shared/engine';
import { parseStrictJson } from '../shared/json/strict-json';
import type { Checklist, RuleSet } from '../shared/rules';
import { RulesError, checklistFor, formatChecklist, loadRules, withMethods } from './calc-rules';

const USAGE =
  'usage: npm run --silent calc -- FILE.json|-|FOLDER [--format json|table] [--rules RULES.json|CODE|CODE@VERSION]';

interface Outcome {
  file: string;
  result?: CalcResult & { checklist?: Checklist; verdict?: string };
  issues?: CalcIssue[];
}

class UsageError extends Error {}

function parseArgs(argv: string[]): { target: string; format: 'json' | 'table'; rules?: string } {
  let format = 'json';
  let rules: string | undefined;
  const rest: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--format') format = argv[++i] ?? '';
    else if (a.startsWith('--format=')) format = a.slice('--format='.length);
    else if (a === '--rules') rules = argv[++i];
    else if (a.startsWith('--rules=')) rules = a.slice('--rules='.length);
    else if (a === '--help' || a === '-h') throw new UsageError(USAGE);
    else if (a.startsWith('--')) throw new UsageError(`unknown option ${a}\n${USAGE}`);
    else rest.push(a);
  }
  if (format !== 'json' && format !== 'table') throw new UsageError(`--format must be json or table, got "${format}"`);
  if (rest.length !== 1) throw new UsageError(USAGE);
  if (rules === '') throw new UsageError('--rules needs a file or a standard code');
  return { target: rest[0], format, rules };
}

function evaluateText(file: string, text: string, ruleSet: RuleSet | null): Outcome {
  const parsed = parseStrictJson(text);
  if (!parsed.ok) return { file, issues: [parsed.issue] };
  const checked = validateCalcInput(parsed.value);
  if (!checked.ok) return { file, issues: checked.issues };
  const input = withMethods(checked.value, ruleSet);
  let result: CalcResult;
  try {
    result = evaluateValidInput(input);
  } catch (e) {
    // A value the range checks let through but the arithmetic could not carry: still bad input, exit 2.
    if (e instanceof CalcInputError) return { file, issues: e.issues };
    throw e;
  }
  if (!ruleSet) return { file, result };
  const checklist = checklistFor(input, result, ruleSet);
  return { file, result: { ...result, checklist, verdict: checklist.verdict } };
}

function readTargets(target: string): { file: string; text: string }[] {
  if (target === '-') return [{ file: '(stdin)', text: readFileSync(0, 'utf8') }];
  let isDir: boolean;
  try {
    isDir = statSync(target).isDirectory();
  } catch {
    throw new UsageError(`cannot read ${target}: no such file or folder`);
  }
  if (!isDir) return [{ file: target, text: readFileSync(target, 'utf8') }];
  const names = readdirSync(target)
    .filter((n) => n.endsWith('.json'))
    .sort();
  if (!names.length) throw new UsageError(`no .json files in folder ${target}`);
  return names.map((n) => ({ file: join(target, n), text: readFileSync(join(target, n), 'utf8') }));
}

function render(outcomes: Outcome[], format: 'json' | 'table', isBatch: boolean): string {
  if (format === 'json') {
    const body = isBatch
      ? outcomes.map((o) => ({ file: basename(o.file), ...(o.result ? { result: o.result } : { issues: o.issues }) }))
      : outcomes[0].result;
    return `${JSON.stringify(body, null, 2)}\n`;
  }
  return outcomes
    .filter((o) => o.result)
    .map(
      (o) =>
        `${isBatch ? `== ${basename(o.file)} ==\n` : ''}${formatResultTable(o.result!)}${o.result!.checklist ? `\n${formatChecklist(o.result!.checklist)}\n` : ''}`,
    )
    .join('\n');
}

async function main(argv: string[]): Promise<number> {
  const { target, format, rules } = parseArgs(argv);
  const ruleSet = rules ? await loadRules(rules) : null;
  const isBatch = target !== '-' && statSync(target, { throwIfNoEntry: false })?.isDirectory() === true;
  const outcomes = readTargets(target).map((t) => evaluateText(t.file, t.text, ruleSet));
  const invalid = outcomes.filter((o) => o.issues);
  for (const o of invalid) {
    for (const i of o.issues!)
      process.stderr.write(`${isBatch ? `${basename(o.file)}: ` : ''}${i.path}: ${i.message}\n`);
  }
  if (isBatch || !invalid.length) process.stdout.write(render(outcomes, format, isBatch));
  return invalid.length ? 2 : 0;
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    // Never a stack trace: usage, file and rule-set problems are one line each; anything else briefly.
    const known = e instanceof UsageError || e instanceof RulesError;
    process.stderr.write(`${known ? '' : 'calc: '}${(e as Error).message}\n`);
    process.exitCode = e instanceof RulesError ? 2 : 1;
  },
);
