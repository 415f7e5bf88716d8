import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

// A migration replays history: it must not change when the app's code does, so it imports only
// Sequelize and Node's built-ins and copies any value it needs as it was when it was written.
const MIGRATIONS = join(__dirname, '..', '..', 'migrations');

describe('migration imports', () => {
  const files = readdirSync(MIGRATIONS).filter((f) => f.endsWith('.ts'));

  it.each(files)('when %s is read, then it imports only sequelize and node built-ins', (file) => {
    const text = readFileSync(join(MIGRATIONS, file), 'utf8');
    const specs = [...text.matchAll(/from\s+'([^']+)'/g)].map((m) => m[1]);
    for (const spec of specs) expect(spec === 'sequelize' || spec.startsWith('node:')).toBe(true);
    expect(text).not.toMatch(/\brequire\(/);
  });
});
