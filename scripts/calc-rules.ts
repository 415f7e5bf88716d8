// The --rules option of the calc command: a design standard from a JSON file, or by code (and
// version) from the database when the server's database is reachable.
import { existsSync, readFileSync } from 'node:fs';
import { parseStrictJson } from '../shared/json/strict-json';
import {
  applyRuleSetMethods,
  evaluateChecklistSync,
  validateRuleSet,
  type Checklist,
  type RuleSet,
} from '../shared/rules';
import type { CalcInput, CalcResult } from '../shared/engine';
import { formatNumber } from '../shared/engine';

export class RulesError extends Error {}

async function fromDatabase(spec: string): Promise<RuleSet> {
  const [code, version] = spec.split('@');
  // Loaded lazily so the command runs without a database when a file is given.
  const { loadConfig } = await import('../server/config');
  const { createSequelize } = await import('../server/db');
  const { RuleSetRecord } = await import('../server/db/models');
  const sequelize = createSequelize({ ...loadConfig(), LOG_LEVEL: 'silent' });
  try {
    await sequelize.authenticate();
    const where = version ? { code, version: Number(version) } : { code, status: 'effective' as const };
    const record = await RuleSetRecord.findOne({ where, order: [['version', 'DESC']] });
    if (!record)
      throw new RulesError(
        `--rules: no ${version ? `${code} version ${version}` : `effective version of ${code}`} in the database`,
      );
    return JSON.parse(record.document) as RuleSet;
  } catch (e) {
    if (e instanceof RulesError) throw e;
    throw new RulesError(
      `--rules: "${spec}" is not a file, and the database could not be read (${(e as Error).message.split('\n')[0]})`,
    );
  } finally {
    await sequelize.close();
  }
}

export async function loadRules(spec: string): Promise<RuleSet> {
  if (!existsSync(spec)) return fromDatabase(spec);
  // The same reader as calc inputs: a BOM is accepted, a key given twice is refused.
  const parsed = parseStrictJson(readFileSync(spec, 'utf8'));
  if (!parsed.ok) throw new RulesError(`--rules ${spec}: ${parsed.issue.path}: ${parsed.issue.message}`);
  const checked = validateRuleSet(parsed.value);
  if (!checked.ok)
    throw new RulesError(checked.issues.map((i) => `--rules ${spec}: ${i.path}: ${i.message}`).join('\n'));
  return checked.value;
}

/** The standard's method choices applied to the input before the engine runs, as the server does. */
export function withMethods(input: CalcInput, ruleSet: RuleSet | null): CalcInput {
  return ruleSet ? applyRuleSetMethods(input, ruleSet) : input;
}

export function checklistFor(input: CalcInput, result: CalcResult, ruleSet: RuleSet): Checklist {
  return evaluateChecklistSync(input, result, ruleSet);
}

const withUnit = (v: number, unit: string) => (unit && unit !== '1' ? `${formatNumber(v)} ${unit}` : formatNumber(v));

export function formatChecklist(c: Checklist): string {
  const rows = c.rows.filter((r) => r.status !== 'not-applicable');
  const lines = rows.map((r) =>
    [
      r.reference.padEnd(22),
      r.status.toUpperCase().padEnd(6),
      r.severity.padEnd(10),
      r.location.label.padEnd(44).slice(0, 44),
      r.actual === null ? ''.padEnd(16) : withUnit(r.actual, r.unit).padEnd(16),
      r.limit === null ? '' : withUnit(r.limit, r.unit),
    ].join(' '),
  );
  return [
    `Checklist against ${c.ruleSet.code} v${c.ruleSet.version}: ${c.verdict.toUpperCase()}`,
    ...c.verdictReasons.map((v) => `  ${v}`),
    ...lines,
    `${c.rows.length - rows.length} rows not applicable are not shown; manual items for the checker: ${c.manual.length}`,
    c.caution,
  ].join('\n');
}
