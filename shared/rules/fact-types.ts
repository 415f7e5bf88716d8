import { PARAM_PREFIX } from './condition-schema';
import { factSpec, factUnit, FACTS } from './fact-registry';
import type { RuleSetIssue } from './rule-set-issues';
import { SCOPES, type Parameter, type Scope } from './rule-set-schema';

/** What a fact or parameter reference stands for, as far as type checking is concerned. */
export interface RefType {
  type: 'number' | 'boolean' | 'string' | 'object';
  isNullable: boolean;
  /** SI unit of a number ('1' dimensionless); null when unknown (a parameter without a unit). */
  unit: string | null;
  values?: readonly string[];
  /** How messages name it: `fact "tauMax"` or `parameter "minYieldSafety"`. */
  what: string;
  /** Parameters a derived fact needs. */
  needs?: readonly string[];
}

export interface CheckContext {
  scope: Scope;
  params: ReadonlyMap<string, Parameter>;
  out: RuleSetIssue[];
}

function editDistance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++)
      cur[j] = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    prev = cur;
  }
  return prev[b.length];
}

/** ` (did you mean "tauMax"?)` when a known name is within two edits. */
export function suggestion(name: string, known: Iterable<string>): string {
  let best = '';
  let bestD = 3;
  for (const k of known) {
    const d = editDistance(name.toLowerCase(), k.toLowerCase());
    if (d < bestD) [best, bestD] = [k, d];
  }
  return best ? ` (did you mean "${best}"?)` : '';
}

function paramType(name: string, path: string, ctx: CheckContext): RefType | null {
  const p = ctx.params.get(name);
  if (!p) {
    ctx.out.push({ path, message: `unknown parameter "${name}"${suggestion(name, ctx.params.keys())}` });
    return null;
  }
  const type = typeof p.value as 'number' | 'boolean' | 'string';
  return { type, isNullable: false, unit: type === 'number' ? (p.unit ?? null) : null, what: `parameter "${name}"` };
}

function memberType(
  name: string,
  member: string | undefined,
  values: readonly string[],
  path: string,
  ctx: CheckContext,
): RefType | null {
  if (member === undefined) return null;
  if (!values.includes(member)) {
    ctx.out.push({ path, message: `"${member}" is not a member of fact "${name}" (${values.join(', ')})` });
    return null;
  }
  return { type: 'number', isNullable: true, unit: '1', what: `fact "${name}" member "${member}"` };
}

/**
 * Type of `{ fact, path }` in the clause scope, or null (with an issue) when it names nothing
 * known. `at` is the path of the "fact" field; a path error is reported beside it.
 */
export function refType(fact: string, path: string | undefined, at: string, ctx: CheckContext): RefType | null {
  const pathAt = at.replace(/fact$/, 'path');
  if (fact.startsWith(PARAM_PREFIX)) {
    if (path !== undefined) ctx.out.push({ path: pathAt, message: 'a parameter is not an object: remove "path"' });
    return paramType(fact.slice(PARAM_PREFIX.length), at, ctx);
  }
  const spec = factSpec(ctx.scope, fact);
  if (!spec) {
    const elsewhere = SCOPES.filter((s) => s !== ctx.scope && factSpec(s, fact));
    const hint = elsewhere.length
      ? ` (it is a fact of scope ${elsewhere.join(', ')})`
      : suggestion(fact, Object.keys(FACTS[ctx.scope]));
    ctx.out.push({ path: at, message: `unknown fact "${fact}" for scope ${ctx.scope}${hint}` });
    return null;
  }
  if (spec.type === 'object' && path !== undefined)
    return memberType(fact, path.slice(2), spec.values ?? [], pathAt, ctx);
  if (spec.type !== 'object' && path !== undefined) {
    ctx.out.push({ path: pathAt, message: `fact "${fact}" is a ${spec.type}, not an object: remove "path"` });
  }
  return {
    type: spec.type,
    isNullable: spec.isNullable,
    unit: spec.type === 'number' ? factUnit(spec) : null,
    values: spec.type === 'string' ? spec.values : undefined,
    what: `fact "${fact}"`,
    needs: spec.params,
  };
}
