import { DataTypes, type QueryInterface } from 'sequelize';

const GENESIS = '0'.repeat(64);

/**
 * The audit table is append-only: triggers refuse UPDATE and DELETE so that not even a
 * mistaken administrator query can rewrite history. (DDL in MariaDB commits implicitly,
 * so this migration is not wrapped in a transaction; `down` undoes it step by step.)
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    occurred_at: { type: DataTypes.DATE(3), allowNull: false },
    actor_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    actor_name: { type: DataTypes.STRING(120), allowNull: false },
    action: { type: DataTypes.STRING(64), allowNull: false },
    entity_type: { type: DataTypes.STRING(32), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: true },
    payload: { type: DataTypes.TEXT('long'), allowNull: false },
    diff: { type: DataTypes.TEXT('long'), allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    prev_hash: { type: DataTypes.CHAR(64), allowNull: false },
    hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
  });
  await qi.addIndex('audit_events', ['entity_type', 'entity_id']);
  await qi.addIndex('audit_events', ['actor_id']);
  // One row holding the chain's head; locking it serialises appends across app instances.
  await qi.createTable('audit_chain_head', {
    id: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
    last_id: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
    last_hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await qi.bulkInsert('audit_chain_head', [{ id: 1, last_id: null, last_hash: GENESIS }]);
  for (const op of ['UPDATE', 'DELETE']) {
    await qi.sequelize.query(
      `CREATE TRIGGER audit_events_no_${op.toLowerCase()} BEFORE ${op} ON audit_events FOR EACH ROW
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only: ${op} is not allowed'`,
    );
  }
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('DROP TRIGGER IF EXISTS audit_events_no_update');
  await qi.sequelize.query('DROP TRIGGER IF EXISTS audit_events_no_delete');
  await qi.dropTable('audit_chain_head');
  await qi.dropTable('audit_events');
}
