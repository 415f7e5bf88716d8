import {
  createFactory,
  $eq,
  $ne,
  $in,
  $nin,
  $lt,
  $lte,
  $gt,
  $gte,
  and,
  eq,
  ne,
  within,
  nin,
  lt,
  lte,
  gt,
  gte,
} from '@ucast/mongo2js';

/* The conditions a permission rule may carry, and the matcher CASL applies them with. */

/**
 * Conditions are limited to operators that translate one-to-one into SQL, so every rule
 * the client sees can also filter a database query on the server (see accessible-where.ts).
 */
export const RESTRICTED_OPERATORS = ['$eq', '$ne', '$in', '$nin', '$lt', '$lte', '$gt', '$gte'] as const;
type Op = (typeof RESTRICTED_OPERATORS)[number];
type Scalar = string | number | boolean | null;
export type RestrictedConditions = Record<string, Scalar | Partial<Record<Op, Scalar | Scalar[]>>>;

export const conditionsMatcher = createFactory(
  { $eq, $ne, $in, $nin, $lt, $lte, $gt, $gte },
  // `and` joins the fields of one condition object; it is implicit, not an operator rules may write.
  { and, eq, ne, in: within, nin, lt, lte, gt, gte },
) as unknown as (conditions: RestrictedConditions) => (object: object) => boolean;
