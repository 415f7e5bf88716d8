import type { Clause, ManualItem, Parameter, RuleSet } from './rule-set-schema';
import { clauseParameters } from './validate-rule-set';
import { verificationLines } from './verification-text';

export interface FieldChange {
  field: string;
  before: unknown;
  after: unknown;
}

export type Change = 'added' | 'removed' | 'changed' | 'unchanged';

export interface ItemDiff<T> {
  /** Clause id, parameter name or manual item id. */
  key: string;
  change: Change;
  /** The fields that differ (empty unless changed). */
  fields: FieldChange[];
  before: T | null;
  after: T | null;
}

export interface RuleSetDiff {
  from: { code: string; version: number };
  to: { code: string; version: number };
  identity: FieldChange[];
  methods: FieldChange[];
  /** How calcs are checked (independent model, scope, tolerances), in plain words, line by line. */
  verification: FieldChange[];
  parameters: (ItemDiff<Parameter> & { usedBy: string[] })[];
  clauses: ItemDiff<Clause>[];
  manualItems: ItemDiff<ManualItem>[];
  counts: Record<'parameters' | 'clauses' | 'manualItems', Record<Exclude<Change, 'unchanged'>, number>>;
}

/** JSON with sorted keys, so documents that went through a database compare by content. */
function canonical(v: unknown): string {
  if (v === undefined) return 'undefined';
  if (v === null || typeof v !== 'object') return JSON.stringify(v);
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  const o = v as Record<string, unknown>;
  return `{${Object.keys(o)
    .filter((k) => o[k] !== undefined)
    .sort()
    .map((k) => `${JSON.stringify(k)}:${canonical(o[k])}`)
    .join(',')}}`;
}

function fieldChanges<T extends object>(a: T, b: T, fields: readonly (keyof T & string)[]): FieldChange[] {
  return fields
    .filter((f) => canonical(a[f]) !== canonical(b[f]))
    .map((f) => ({ field: f, before: a[f] ?? null, after: b[f] ?? null }));
}

/** Items matched by key: b's order, then those only in a. */
function diffList<T extends object>(
  a: readonly T[],
  b: readonly T[],
  key: (x: T) => string,
  fields: readonly (keyof T & string)[],
): ItemDiff<T>[] {
  const before = new Map(a.map((x) => [key(x), x]));
  const after = new Set(b.map(key));
  const out: ItemDiff<T>[] = b.map((x) => {
    const old = before.get(key(x));
    if (!old) return { key: key(x), change: 'added', fields: [], before: null, after: x };
    const fc = fieldChanges(old, x, fields);
    return { key: key(x), change: fc.length ? 'changed' : 'unchanged', fields: fc, before: old, after: x };
  });
  for (const x of a)
    if (!after.has(key(x))) out.push({ key: key(x), change: 'removed', fields: [], before: x, after: null });
  return out;
}

function count(list: readonly ItemDiff<unknown>[]): Record<Exclude<Change, 'unchanged'>, number> {
  return {
    added: list.filter((d) => d.change === 'added').length,
    removed: list.filter((d) => d.change === 'removed').length,
    changed: list.filter((d) => d.change === 'changed').length,
  };
}

/**
 * Differences from rule set `a` to `b` for the side-by-side screen: identity fields, method
 * choices, and clause by clause, parameter by parameter and manual item by manual item (added,
 * removed, changed with the fields that differ; unchanged items are listed too). Each parameter
 * names the clauses of `b` (or `a`, if removed) whose check or measure uses it.
 */
export function diffRuleSets(a: RuleSet, b: RuleSet): RuleSetDiff {
  const parameters = diffList(a.parameters, b.parameters, (p) => p.name, ['label', 'value', 'unit', 'origin']).map(
    (d) => ({
      ...d,
      usedBy: (d.after ? b : a).clauses.filter((c) => clauseParameters(c).includes(d.key)).map((c) => c.id),
    }),
  );
  const clauses = diffList(a.clauses, b.clauses, (c) => c.id, [
    'title',
    'text',
    'severity',
    'scope',
    'applicability',
    'check',
    'measure',
    'materialScope',
  ]);
  const manualItems = diffList(a.manualItems, b.manualItems, (m) => m.id, ['text', 'requiresAttachment']);
  return {
    from: { code: a.code, version: a.version },
    to: { code: b.code, version: b.version },
    identity: fieldChanges(a, b, ['code', 'title', 'version', 'status', 'effectiveDate', 'changeSummary', 'scope']),
    methods: fieldChanges(a.methods, b.methods, [
      'filletKts',
      'filletKt',
      'surfaceTable',
      'kfOnMidrange',
      'fatigueCriterion',
      'reliability',
    ]),
    verification: fieldChanges(verificationLines(a.verification), verificationLines(b.verification), [
      'requirement',
      'inputs',
      'results',
      'origin',
    ]).map((f) => ({ ...f, field: `checking ${f.field}` })),
    parameters,
    clauses,
    manualItems,
    counts: { parameters: count(parameters), clauses: count(clauses), manualItems: count(manualItems) },
  };
}
