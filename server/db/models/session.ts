import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

/** Server-side sessions, shared by every app instance on the same database. */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare sid: string;
  declare expires: Date | null;
  declare data: string | null;
  declare userId: number | null;
  declare ip: CreationOptional<string | null>;
  declare userAgent: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Session.init(
      {
        sid: { type: DataTypes.STRING(64), primaryKey: true },
        expires: { type: DataTypes.DATE, allowNull: true },
        data: { type: DataTypes.TEXT('medium'), allowNull: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        ip: { type: DataTypes.STRING(100), allowNull: true },
        userAgent: { type: DataTypes.STRING(400), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sessions', underscored: true },
    );
  }
}
