import { QueryTypes } from 'sequelize';
import { startTestApp } from '../support/api-harness';

const { sequelize } = startTestApp();
afterAll(() => sequelize.close());

/**
 * A Galera cluster (README, "Scaling") replicates InnoDB tables only, and rows of a table without a
 * primary key cannot be certified or applied reliably: every table, including the session and
 * rate-limit tables and the migrations' own, must have both.
 */
describe('schema ready for a Galera cluster', () => {
  it('when the schema is migrated, then every table is InnoDB with a primary key', async () => {
    // Arrange
    const sql = `SELECT t.table_name AS name, t.engine AS engine, c.constraint_name AS pk FROM information_schema.tables t
      LEFT JOIN information_schema.table_constraints c ON c.table_schema = t.table_schema AND c.table_name = t.table_name AND c.constraint_type = 'PRIMARY KEY'
      WHERE t.table_schema = DATABASE() AND t.table_type = 'BASE TABLE'`;

    // Act
    const tables = await sequelize.query<{ name: string; engine: string; pk: string | null }>(sql, {
      type: QueryTypes.SELECT,
    });

    // Assert
    expect(tables.length).toBeGreaterThan(10);
    expect(tables.filter((t) => t.engine !== 'InnoDB' || !t.pk).map((t) => t.name)).toEqual([]);
  });
});
