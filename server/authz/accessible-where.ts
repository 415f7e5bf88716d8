import { ForbiddenError } from '@casl/ability';
import { rulesToQuery } from '@casl/ability/extra';
import { Op, type WhereOptions } from 'sequelize';
import type { Action, AppAbility, SubjectName } from '../../shared/authz/app-ability';

// Explicit operator table: a rule using anything else is a programming error, not a silent pass.
const OPERATORS: Record<string, symbol> = {
  $eq: Op.eq,
  $ne: Op.ne,
  $in: Op.in,
  $nin: Op.notIn,
  $lt: Op.lt,
  $lte: Op.lte,
  $gt: Op.gt,
  $gte: Op.gte,
};

function convertCondition(conditions: Record<string, unknown>): WhereOptions {
  const where: Record<string, unknown> = {};
  for (const [field, value] of Object.entries(conditions)) {
    if (value === null || typeof value !== 'object' || Array.isArray(value)) {
      where[field] = value;
      continue;
    }
    const ops: Record<symbol, unknown> = {};
    for (const [op, operand] of Object.entries(value)) {
      const sqlOp = OPERATORS[op];
      if (!sqlOp) throw new Error(`Ability condition operator ${op} cannot be turned into SQL`);
      ops[sqlOp] = operand;
    }
    where[field] = ops;
  }
  return where;
}

/**
 * Turns the ability's rules for (action, subject) into a Sequelize `where`, so list queries
 * return only rows the user may see. Throws ForbiddenError when no rule allows the action.
 */
export function accessibleWhere(
  ability: AppAbility,
  action: Action,
  subjectType: Exclude<SubjectName, 'all'>,
): WhereOptions {
  const query = rulesToQuery(ability, action, subjectType, (rule) => {
    if (!rule.ast) throw new Error('Ability rule without conditions reached the converter');
    return rule.inverted
      ? { [Op.not]: convertCondition(rule.conditions as Record<string, unknown>) }
      : convertCondition(rule.conditions as Record<string, unknown>);
  });
  if (query === null) {
    throw ForbiddenError.from(ability).setMessage(`You are not allowed to ${action} ${subjectType} records`);
  }
  const parts: WhereOptions[] = [];
  if (query.$or) parts.push({ [Op.or]: query.$or });
  if (query.$and) parts.push({ [Op.and]: query.$and });
  return parts.length ? { [Op.and]: parts } : {};
}
