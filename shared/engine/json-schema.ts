import { z } from 'zod';
import { calcInputSchema } from './schema';

/**
 * JSON Schema of the input, generated from zod so the two cannot drift (a unit test fails when the
 * committed calc-input.schema.json is stale). Cross-field rules are not expressible there.
 */
export function calcInputJsonSchemaText(): string {
  const schema = z.toJSONSchema(calcInputSchema, { target: 'draft-2020-12' });
  const { $schema, ...rest } = schema;
  return `${JSON.stringify({ $schema, $id: 'urn:torquetrail:schema:calc-input:v2', ...rest }, null, 2)}\n`;
}
