import { z } from 'zod';
import { ruleSetSchema } from './rule-set-schema';

/**
 * JSON Schema of the rule-set document, generated from zod so the two cannot drift (a unit test
 * fails when the committed rule-set.schema.json is stale). Fact names, parameter types and units
 * are checked by validateRuleSet only.
 */
export function ruleSetJsonSchemaText(): string {
  const schema = z.toJSONSchema(ruleSetSchema, { target: 'draft-2020-12' });
  const { $schema, ...rest } = schema;
  return `${JSON.stringify({ $schema, $id: 'urn:torquetrail:schema:rule-set:v1', ...rest }, null, 2)}\n`;
}
