// Writes shared/engine/calc-input.schema.json from the engine's zod schema (run: npx tsx scripts/gen-calc-schema.ts).
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { calcInputJsonSchemaText } from '../shared/engine/json-schema';

const target = join(__dirname, '..', 'shared', 'engine', 'calc-input.schema.json');
writeFileSync(target, calcInputJsonSchemaText());
process.stdout.write(`wrote ${target}\n`);
