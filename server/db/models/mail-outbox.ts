import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

/** Mail written in the same transaction as the hand-over it announces; a sender delivers it later. */
export class MailOutbox extends Model<InferAttributes<MailOutbox>, InferCreationAttributes<MailOutbox>> {
  declare id: CreationOptional<number>;
  declare event: string;
  declare recipient: string;
  declare subject: string;
  declare body: string;
  declare status: CreationOptional<'pending' | 'sent' | 'failed'>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date;
  declare sentAt: CreationOptional<Date | null>;
  declare lastError: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    MailOutbox.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        event: { type: DataTypes.STRING(40), allowNull: false },
        recipient: { type: DataTypes.STRING(190), allowNull: false },
        subject: { type: DataTypes.STRING(250), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
        sentAt: { type: DataTypes.DATE(3), allowNull: true },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'mail_outbox', underscored: true, updatedAt: false },
    );
  }
}
