import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Each audit row names the calc and project it belongs to, so "everything under this project"
 * is one index range instead of three sub-queries over revisions. The two columns are look-up
 * aids outside the hashed content: the hash still covers entity type and id, which decide them.
 */
const NO_UPDATE = `CREATE TRIGGER audit_events_no_update BEFORE UPDATE ON audit_events FOR EACH ROW
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only: UPDATE is not allowed'`;

// With the primary key appended by InnoDB, each index is also ordered newest-last by id.
const INDEXES: [string, string[]][] = [
  ['audit_events_project', ['project_id']],
  ['audit_events_calc', ['calc_id']],
  ['audit_events_action', ['action']],
  ['audit_events_type', ['entity_type']],
  ['audit_events_occurred', ['occurred_at']],
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('audit_events', 'calc_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  await qi.addColumn('audit_events', 'project_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  // Filling the new columns on existing rows needs the append-only guard lifted for this one statement set.
  await qi.sequelize.query('DROP TRIGGER IF EXISTS audit_events_no_update');
  try {
    // The data in one transaction (the DDL around it commits implicitly in MariaDB): all rows or none.
    await qi.sequelize.transaction(async (transaction) => {
      await qi.sequelize.query(
        "UPDATE audit_events SET project_id = CAST(entity_id AS UNSIGNED) WHERE entity_type = 'Project'",
        { transaction },
      );
      await qi.sequelize.query(
        `UPDATE audit_events a JOIN calcs c ON a.entity_type = 'Calc' AND c.id = CAST(a.entity_id AS UNSIGNED)
        SET a.calc_id = c.id, a.project_id = c.project_id`,
        { transaction },
      );
      await qi.sequelize.query(
        `UPDATE audit_events a JOIN revisions r ON a.entity_type = 'Revision'
        AND r.id = CAST(a.entity_id AS UNSIGNED) JOIN calcs c ON c.id = r.calc_id
        SET a.calc_id = c.id, a.project_id = c.project_id`,
        { transaction },
      );
    });
  } finally {
    await qi.sequelize.query(NO_UPDATE);
  }
  for (const [name, fields] of INDEXES) await qi.addIndex('audit_events', fields, { name });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const [name] of INDEXES) await qi.removeIndex('audit_events', name);
  await qi.removeColumn('audit_events', 'project_id');
  await qi.removeColumn('audit_events', 'calc_id');
}
