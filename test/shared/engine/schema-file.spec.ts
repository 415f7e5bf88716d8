import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { calcInputJsonSchemaText, validateCalcInput } from '../../../shared/engine';
import { loadFixture } from './check-helpers';

const ROOT = join(__dirname, '..', '..', '..');
const FIXTURES = join(ROOT, 'test', 'fixtures', 'calcs');

describe('published JSON Schema and fixtures', () => {
  it('when the schema is regenerated from zod, then the committed calc-input.schema.json is identical', () => {
    // Fails when someone changes schema.ts without running `npx tsx scripts/gen-calc-schema.ts`.
    const committed = readFileSync(join(ROOT, 'shared', 'engine', 'calc-input.schema.json'), 'utf8');
    expect(committed).toBe(calcInputJsonSchemaText());
  });

  it('when the schema is read, then it names every top-level field of format v1', () => {
    const schema = JSON.parse(calcInputJsonSchemaText());
    expect(Object.keys(schema.properties)).toEqual(
      expect.arrayContaining(['units', 'material', 'segments', 'torques', 'features', 'bending', 'fatigue']),
    );
    expect(schema.required).toEqual(expect.arrayContaining(['units', 'material', 'segments', 'torques']));
  });

  it.each(readdirSync(FIXTURES).filter((f) => f.endsWith('.json')))(
    'when fixture %s is validated, then it passes',
    (name) => {
      expect(validateCalcInput(loadFixture(name))).toMatchObject({ ok: true });
    },
  );

  it.each(readdirSync(join(FIXTURES, 'invalid')))(
    'when invalid fixture %s is validated, then it fails with named paths',
    (name) => {
      const r = validateCalcInput(loadFixture(`invalid/${name}`));
      expect(r.ok).toBe(false);
      if (!r.ok) for (const issue of r.issues) expect(issue.path).not.toBe('');
    },
  );
});
