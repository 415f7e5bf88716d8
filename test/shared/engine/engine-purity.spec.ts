import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

// The engine runs in the browser too: no Node built-ins, no framework, only zod (project rule).
const ENGINE = join(__dirname, '..', '..', '..', 'shared', 'engine');

describe('engine imports', () => {
  const files = readdirSync(ENGINE).filter((f) => f.endsWith('.ts'));

  it.each(files)('when %s is read, then it imports only sibling files and zod', (file) => {
    const text = readFileSync(join(ENGINE, file), 'utf8');
    const specs = [...text.matchAll(/from\s+'([^']+)'/g)].map((m) => m[1]);
    for (const spec of specs) expect(spec === 'zod' || spec.startsWith('./')).toBe(true);
    expect(text).not.toMatch(/\brequire\(|process\.|globalThis\.|\bwindow\./);
  });
});
