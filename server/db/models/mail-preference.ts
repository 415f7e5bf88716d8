import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

/** One person's choice for one mail event; no row means the mail is sent. */
export class MailPreference extends Model<InferAttributes<MailPreference>, InferCreationAttributes<MailPreference>> {
  declare userId: number;
  declare event: string;
  declare enabled: boolean;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    MailPreference.init(
      {
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        event: { type: DataTypes.STRING(40), primaryKey: true },
        enabled: { type: DataTypes.BOOLEAN, allowNull: false },
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'mail_preferences', underscored: true, createdAt: false },
    );
  }
}
