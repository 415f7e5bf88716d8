import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ruleSetJsonSchemaText } from '../../../shared/rules';

const ROOT = join(__dirname, '..', '..', '..');
const SCHEMA_FILE = join(ROOT, 'shared', 'rules', 'rule-set.schema.json');
const RULES = join(ROOT, 'shared', 'rules');

describe('published rule-set JSON Schema', () => {
  it('when regenerated from zod, then the committed rule-set.schema.json is identical', () => {
    // To refresh after changing rule-set-schema.ts: UPDATE_RULE_SET_SCHEMA=1 npx jest test/shared/rules/schema-file
    // --selectProjects unit
    if (process.env.UPDATE_RULE_SET_SCHEMA === '1') writeFileSync(SCHEMA_FILE, ruleSetJsonSchemaText());
    expect(readFileSync(SCHEMA_FILE, 'utf8')).toBe(ruleSetJsonSchemaText());
  });

  it('when read, then it requires the identity fields, methods, parameters, clauses and manual items', () => {
    const schema = JSON.parse(ruleSetJsonSchemaText());
    expect(schema.required).toEqual(
      expect.arrayContaining([
        'code',
        'title',
        'version',
        'status',
        'effectiveDate',
        'methods',
        'parameters',
        'clauses',
        'manualItems',
      ]),
    );
    expect(schema.$defs.condition).toBeDefined();
  });
});

describe('rule code imports', () => {
  // shared/rules runs in the browser too: only sibling files, the engine, zod and json-rules-engine.
  it.each(readdirSync(RULES).filter((f) => f.endsWith('.ts')))(
    'when %s is read, then it imports nothing else',
    (file) => {
      const text = readFileSync(join(RULES, file), 'utf8');
      for (const [, spec] of text.matchAll(/from\s+'([^']+)'/g)) {
        expect(['zod', 'json-rules-engine', '../engine'].includes(spec) || spec.startsWith('./')).toBe(true);
      }
      expect(text).not.toMatch(/\brequire\(|process\.|globalThis\.|\bwindow\./);
    },
  );
});
