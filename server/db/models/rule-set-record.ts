import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

export type RuleSetStatus = 'draft' | 'effective' | 'retired';

/**
 * A DATE column as the app speaks it, `YYYY-MM-DD`: the driver's own decoding (server/db/index.ts) gives a Date at
 * local midnight, built from the stored year, month and day, which are read back here.
 */
export function isoDateOf(value: unknown): string | null {
  if (!(value instanceof Date)) return (value as string | null) ?? null;
  const two = (n: number) => String(n).padStart(2, '0');
  return `${value.getFullYear()}-${two(value.getMonth() + 1)}-${two(value.getDate())}`;
}

/** One version of a design standard. Effective and retired versions never change again. */
export class RuleSetRecord extends Model<InferAttributes<RuleSetRecord>, InferCreationAttributes<RuleSetRecord>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare version: number;
  declare title: string;
  declare status: CreationOptional<RuleSetStatus>;
  declare effectiveDate: string | null;
  declare document: string;
  declare contentHash: string;
  declare createdBy: number | null;
  declare proposedBy: CreationOptional<number | null>;
  declare confirmedBy: CreationOptional<number | null>;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    RuleSetRecord.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(40), allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        status: { type: DataTypes.ENUM('draft', 'effective', 'retired'), allowNull: false, defaultValue: 'draft' },
        effectiveDate: {
          type: DataTypes.DATEONLY,
          allowNull: true,
          get() {
            return isoDateOf(this.getDataValue('effectiveDate'));
          },
        },
        document: { type: DataTypes.TEXT('long'), allowNull: false },
        contentHash: { type: DataTypes.CHAR(64), allowNull: false },
        createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        proposedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        confirmedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        lockVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'rule_sets', underscored: true, version: 'lockVersion' },
    );
  }
}
