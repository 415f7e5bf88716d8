import { QueryTypes } from 'sequelize';
import { startTestApp } from '../support/api-harness';

const { sequelize } = startTestApp();
afterAll(() => sequelize.close());

/** The column definitions MariaDB reports for a table, by column name. */
async function columnsOf(table: string): Promise<Map<string, string>> {
  const [row] = await sequelize.query<{ 'Create Table': string }>(`SHOW CREATE TABLE ${table}`, {
    type: QueryTypes.SELECT,
  });
  const lines = row['Create Table'].split('\n').filter((l) => l.trim().startsWith('`'));
  return new Map(lines.map((l) => [l.trim().split('`')[1], l]));
}

describe('large JSON texts are stored compressed', () => {
  it.each([
    ['revisions', ['input', 'result', 'checklist']],
    ['independent_models', ['input', 'result', 'checklist', 'comparison']],
  ])('when the %s table is read, then its JSON text columns are compressed', async (table, names) => {
    const columns = await columnsOf(table);
    for (const name of names) expect([name, columns.get(name)]).toEqual([name, expect.stringContaining('COMPRESSED')]);
  });
});
