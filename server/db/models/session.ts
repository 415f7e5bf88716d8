import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes } from 'sequelize';

/** Server-side sessions, shared by every app instance on the same database. */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare sid: string;
  declare expires: Date | null;
  declare data: string | null;
  declare userId: number | null;

  static initModel(sequelize: Sequelize): void {
    Session.init(
      {
        sid: { type: DataTypes.STRING(64), primaryKey: true },
        expires: { type: DataTypes.DATE, allowNull: true },
        data: { type: DataTypes.TEXT('medium'), allowNull: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      { sequelize, tableName: 'sessions', underscored: true },
    );
  }
}
