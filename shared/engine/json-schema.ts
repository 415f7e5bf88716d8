import { z } from 'zod';
import { calcInputSchema } from './schema';

/**
 * The published JSON Schema of the input format, generated from the zod schema so the two cannot
 * drift (scripts/gen-calc-schema.ts writes it to calc-input.schema.json; a unit test fails when
 * the committed file is stale). Cross-field rules (id < od, balance …) are not expressible there.
 */
export function calcInputJsonSchemaText(): string {
  const schema = z.toJSONSchema(calcInputSchema, { target: 'draft-2020-12' });
  const { $schema, ...rest } = schema;
  return `${JSON.stringify({ $schema, $id: 'urn:torquetrail:schema:calc-input:v1', ...rest }, null, 2)}\n`;
}
