import { z } from 'zod';

/*
 * The json-rules-engine condition language as Torquetrail rule sets use it: all / any / not and
 * fact conditions with the engine's ten default operators. Priorities, named condition references,
 * fact params and operator decorators are left out on purpose: without them every condition is
 * evaluated the same way by json-rules-engine and by the synchronous evaluator (sync-evaluator.ts).
 */
export const OPERATORS = [
  'equal',
  'notEqual',
  'in',
  'notIn',
  'contains',
  'doesNotContain',
  'lessThan',
  'lessThanInclusive',
  'greaterThan',
  'greaterThanInclusive',
] as const;
export type Operator = (typeof OPERATORS)[number];

/** Prefix that turns a rule-set parameter into a fact: `{ "fact": "param:minYieldSafety" }`. */
export const PARAM_PREFIX = 'param:';

// Only `$.name` paths: a one-step JSONPath that json-rules-engine resolves into an object fact.
const pathSchema = z
  .string()
  .regex(/^\$\.[A-Za-z][A-Za-z0-9]*$/, 'path must have the form "$.name"')
  .meta({ description: 'One-step JSONPath into an object fact, e.g. "$.goodman"' });

const factName = z
  .string()
  .min(1)
  .max(80)
  .meta({ description: 'A fact of the clause scope, or "param:<name>" for a rule-set parameter' });

export const factRefSchema = z
  .strictObject({ fact: factName, path: pathSchema.optional() })
  .meta({ description: 'Compare with another fact or a parameter instead of a literal' });

const scalar = z.union([z.number(), z.string().max(200), z.boolean(), z.null()]);

export type Scalar = z.infer<typeof scalar>;
export type FactRef = z.infer<typeof factRefSchema>;

export interface FactCondition {
  fact: string;
  operator: Operator;
  value: Scalar | Scalar[] | FactRef;
  path?: string;
}
export type Condition = FactCondition | { all: Condition[] } | { any: Condition[] } | { not: Condition };
export type TopCondition = { all: Condition[] } | { any: Condition[] } | { not: Condition };

// Branch order matters to rule-set-issues.ts: the fact branch is first in both unions below.
const factConditionSchema = z.strictObject({
  fact: factName,
  operator: z.enum(OPERATORS),
  value: z.union([factRefSchema, scalar, z.array(scalar).max(200)]),
  path: pathSchema.optional(),
});

export const conditionSchema: z.ZodType<Condition> = z
  .lazy(() =>
    z.union([
      factConditionSchema,
      z.strictObject({ all: z.array(conditionSchema).max(100) }),
      z.strictObject({ any: z.array(conditionSchema).min(1).max(100) }),
      z.strictObject({ not: conditionSchema }),
    ]),
  )
  .meta({ id: 'condition', description: 'json-rules-engine condition' });

/*
 * A rule's root must be all, any or not (json-rules-engine refuses a bare fact condition there).
 * `{ "all": [] }` reads "everywhere" and is true in the engine; an empty `any` is true there too,
 * which nobody would guess, so it is refused.
 */
export const topConditionSchema: z.ZodType<TopCondition> = z.union([
  z.strictObject({ all: z.array(conditionSchema).max(100) }),
  z.strictObject({ any: z.array(conditionSchema).min(1).max(100) }),
  z.strictObject({ not: conditionSchema }),
]);

export function isFactCondition(c: Condition): c is FactCondition {
  return Object.prototype.hasOwnProperty.call(c, 'fact');
}

export function isFactRef(v: FactCondition['value']): v is FactRef {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}
