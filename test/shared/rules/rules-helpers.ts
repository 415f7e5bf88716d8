import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { evaluateValidInput, validateCalcInput, type CalcInput } from '../../../shared/engine';
import {
  applyRuleSetMethods,
  evaluateChecklistSync,
  validateRuleSet,
  type Checklist,
  type ChecklistRow,
  type RuleSet,
} from '../../../shared/rules';
import { evaluateChecklist } from '../../../shared/rules/reference-checklist';

const ROOT = join(__dirname, '..', '..', '..');

export const RULE_FILES = [
  'kfd-eng-014-v4.json',
  'kfd-eng-014-v3.json',
  'kfd-eng-014-v2.json',
  'kfd-eng-021-v1.json',
] as const;

export function rawRuleSet(file: string): Record<string, any> {
  return JSON.parse(readFileSync(join(ROOT, 'rules', file), 'utf8'));
}

export function loadRuleSet(file: string): RuleSet {
  const v = validateRuleSet(rawRuleSet(file));
  if (!v.ok) throw new Error(`${file}: ${JSON.stringify(v.issues)}`);
  return v.value;
}

export const V3 = loadRuleSet('kfd-eng-014-v3.json');
export const V2 = loadRuleSet('kfd-eng-014-v2.json');
export const LIFT = loadRuleSet('kfd-eng-021-v1.json');

/** The rule set cut down to the named clauses (same identity: the caches tell them apart by content). */
export function only(ruleSet: RuleSet, ids: string[]): RuleSet {
  return { ...ruleSet, clauses: ruleSet.clauses.filter((c) => ids.includes(c.id)) };
}

export function loadCalc(name: string): CalcInput {
  const v = validateCalcInput(JSON.parse(readFileSync(join(ROOT, 'test', 'fixtures', 'calcs', name), 'utf8')));
  if (!v.ok) throw new Error(`${name}: ${JSON.stringify(v.issues)}`);
  return v.value;
}

export interface Material {
  name?: string;
  kind?: 'steel' | 'aluminium';
  E: number;
  G: number;
  Sy: number;
  Su: number;
}

/** AISI 1045 CD and 1018 HR as docs/references.md C-9 gives them (Sy/Su in MPa; E, G Shigley Table A-5). */
export const STEEL_1045_CD: Material = { name: 'AISI 1045 CD', kind: 'steel', E: 207, G: 79.3, Sy: 530, Su: 630 };
export const STEEL_1018_HR: Material = { name: 'AISI 1018 HR', kind: 'steel', E: 207, G: 79.3, Sy: 220, Su: 400 };

/** One solid or hollow SI segment carrying T (N·m) end to end, with optional features. */
export function shaft(
  od: number,
  T: number,
  material: Material = STEEL_1045_CD,
  extra: Partial<CalcInput> = {},
  id = 0,
  length = 1000,
): CalcInput {
  const v = validateCalcInput({
    units: 'SI',
    material,
    segments: [{ length, od, id }],
    torques: [
      { at: 0, T },
      { at: length, T: -T },
    ],
    ...extra,
  });
  if (!v.ok) throw new Error(JSON.stringify(v.issues));
  return v.value;
}

/** T (N·m) that gives the nominal shear stress tau (MPa) on a solid shaft of diameter d (mm): τ = 16T/(πd³). */
export function torqueForShear(tau: number, d: number): number {
  return (tau * Math.PI * d ** 3) / 16 / 1000;
}

export function checklistSync(input: CalcInput, ruleSet: RuleSet): Checklist {
  const effective = applyRuleSetMethods(input, ruleSet);
  return evaluateChecklistSync(effective, evaluateValidInput(effective), ruleSet);
}

export async function checklistAsync(input: CalcInput, ruleSet: RuleSet): Promise<Checklist> {
  const effective = applyRuleSetMethods(input, ruleSet);
  return evaluateChecklist(effective, evaluateValidInput(effective), ruleSet);
}

export function rowsOf(c: Checklist, clauseId: string): ChecklistRow[] {
  return c.rows.filter((r) => r.clauseId === clauseId);
}
