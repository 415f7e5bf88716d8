import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

/** The organisation's review-health thresholds: one row (id 1), changed by admin or compliance with an audit entry. */
export class ReviewHealthSettings extends Model<
  InferAttributes<ReviewHealthSettings>,
  InferCreationAttributes<ReviewHealthSettings>
> {
  declare id: number;
  declare quickCheckSecondsPerItem: number;
  declare silentCheckerChecks: number;
  declare pairingSharePercent: number;
  declare pairingMinChecks: number;
  declare refusalRepeatCount: number;
  declare replacedWithinDays: number;
  declare lockVersion: CreationOptional<number>;
  declare updatedBy: number | null;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    const int = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: false });
    ReviewHealthSettings.init(
      {
        id: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
        quickCheckSecondsPerItem: int(),
        silentCheckerChecks: int(),
        pairingSharePercent: int(),
        pairingMinChecks: int(),
        refusalRepeatCount: int(),
        replacedWithinDays: int(),
        lockVersion: int(),
        updatedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'review_health_settings', underscored: true, createdAt: false },
    );
  }
}
