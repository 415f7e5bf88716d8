import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

/**
 * One row per event, append-only (database triggers refuse UPDATE and DELETE). Rows are chained:
 * `hash` = SHA-256 over the previous row's hash and this row's canonical content.
 */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare occurredAt: Date;
  declare actorId: number | null;
  declare actorName: string;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  declare payload: string;
  declare diff: string | null;
  declare ip: string | null;
  declare prevHash: string;
  declare hash: string;
  /** Look-up aids outside the hashed content: the calc and project the entity falls under. */
  declare calcId: CreationOptional<number | null>;
  declare projectId: CreationOptional<number | null>;

  static initModel(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        occurredAt: { type: DataTypes.DATE(3), allowNull: false },
        actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        actorName: { type: DataTypes.STRING(120), allowNull: false },
        action: { type: DataTypes.STRING(64), allowNull: false },
        entityType: { type: DataTypes.STRING(32), allowNull: false },
        entityId: { type: DataTypes.STRING(64), allowNull: true },
        payload: { type: DataTypes.TEXT('long'), allowNull: false },
        diff: { type: DataTypes.TEXT('long'), allowNull: true },
        ip: { type: DataTypes.STRING(255), allowNull: true },
        prevHash: { type: DataTypes.CHAR(64), allowNull: false },
        hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        calcId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        projectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      { sequelize, tableName: 'audit_events', underscored: true, timestamps: false },
    );
  }
}
