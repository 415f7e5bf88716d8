// Batch command: evaluates shaft calc inputs (a file, "-" for standard input, or every *.json in a folder).
// Exit status: 0 all valid, 2 any invalid input (messages on stderr), 1 usage or file errors.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { evaluateValidInput, formatResultTable, validateCalcInput, type CalcIssue, type CalcResult } from '../shared/engine';

const USAGE = 'usage: npm run --silent calc -- FILE.json|-|FOLDER [--format json|table]';

interface Outcome { file: string; result?: CalcResult; issues?: CalcIssue[] }

class UsageError extends Error {}

function parseArgs(argv: string[]): { target: string; format: 'json' | 'table' } {
  let format = 'json';
  const rest: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--format') format = argv[++i] ?? '';
    else if (a.startsWith('--format=')) format = a.slice('--format='.length);
    else if (a === '--help' || a === '-h') throw new UsageError(USAGE);
    else if (a.startsWith('--')) throw new UsageError(`unknown option ${a}\n${USAGE}`);
    else rest.push(a);
  }
  if (format !== 'json' && format !== 'table') throw new UsageError(`--format must be json or table, got "${format}"`);
  if (rest.length !== 1) throw new UsageError(USAGE);
  return { target: rest[0], format };
}

function evaluateText(file: string, text: string): Outcome {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    return { file, issues: [{ path: '(input)', message: `not valid JSON: ${(e as Error).message}` }] };
  }
  const checked = validateCalcInput(data);
  return checked.ok ? { file, result: evaluateValidInput(checked.value) } : { file, issues: checked.issues };
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
  const names = readdirSync(target).filter((n) => n.endsWith('.json')).sort();
  if (!names.length) throw new UsageError(`no .json files in folder ${target}`);
  return names.map((n) => ({ file: join(target, n), text: readFileSync(join(target, n), 'utf8') }));
}

function render(outcomes: Outcome[], format: 'json' | 'table', isBatch: boolean): string {
  if (format === 'json') {
    const body = isBatch ? outcomes.map((o) => ({ file: basename(o.file), ...(o.result ? { result: o.result } : { issues: o.issues }) }))
      : outcomes[0].result;
    return `${JSON.stringify(body, null, 2)}\n`;
  }
  return outcomes.filter((o) => o.result)
    .map((o) => `${isBatch ? `== ${basename(o.file)} ==\n` : ''}${formatResultTable(o.result!)}`).join('\n');
}

function main(argv: string[]): number {
  const { target, format } = parseArgs(argv);
  const isBatch = target !== '-' && statSync(target, { throwIfNoEntry: false })?.isDirectory() === true;
  const outcomes = readTargets(target).map((t) => evaluateText(t.file, t.text));
  const invalid = outcomes.filter((o) => o.issues);
  for (const o of invalid) {
    for (const i of o.issues!) process.stderr.write(`${isBatch ? `${basename(o.file)}: ` : ''}${i.path}: ${i.message}\n`);
  }
  if (isBatch || !invalid.length) process.stdout.write(render(outcomes, format, isBatch));
  return invalid.length ? 2 : 0;
}

try {
  process.exitCode = main(process.argv.slice(2));
} catch (e) {
  // Never a stack trace: usage and file problems are one line; anything else is reported briefly.
  process.stderr.write(`${e instanceof UsageError ? '' : 'calc: '}${(e as Error).message}\n`);
  process.exitCode = 1;
}
