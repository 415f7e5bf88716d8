import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';

// Time limits are hang detectors set once per project (jest.config.js and test/support/long-test-timeout.ts).
// A spec that sets a tighter limit of its own fails when the machine is busy, not when the code is wrong.
const ROOT = join(__dirname, '..', '..');

function specsUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return entry.name === 'node_modules' ? [] : specsUnder(path);
    return entry.name.endsWith('.spec.ts') ? [path] : [];
  });
}

describe('time limits of specs', () => {
  const specs = [...specsUnder(join(ROOT, 'test')), ...specsUnder(join(ROOT, 'src'))];

  it('finds the specs (so this check cannot pass by reading nothing)', () => {
    expect(specs.length).toBeGreaterThan(100);
  });

  it('when any spec is read, then it sets no time limit of its own', () => {
    const offending = specs.filter((file) => {
      const text = readFileSync(file, 'utf8');
      // jest's own setTimeout, or a number as the last argument of it/test/beforeAll/afterAll (`}, 60_000);`).
      return /jest\.setTimeout\(/.test(text) || /^\s*\}\s*,\s*[\d_]+\s*\);\s*$/m.test(text);
    });
    expect(offending.map((f) => relative(ROOT, f))).toEqual([]);
  });
});
