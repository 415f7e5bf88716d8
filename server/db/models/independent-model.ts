import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

/**
 * A checker's independent model of one revision: a calc input in the same format as the author's,
 * the server's result and checklist for it, and once locked the comparison (server/independent/).
 */
export class IndependentModel extends Model<
  InferAttributes<IndependentModel>,
  InferCreationAttributes<IndependentModel>
> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare checkerId: number;
  declare input: string;
  declare result: CreationOptional<string | null>;
  declare checklist: CreationOptional<string | null>;
  declare verdict: CreationOptional<string | null>;
  declare lockedAt: CreationOptional<Date | null>;
  /** SHA-256 of the canonical JSON of the checker's input, result and checklist, set on lock. */
  declare modelHash: CreationOptional<string | null>;
  /** Hash of the author's input, result and checklist the comparison was made against. */
  declare authorHash: CreationOptional<string | null>;
  declare comparison: CreationOptional<string | null>;
  declare agrees: CreationOptional<boolean | null>;
  /** JSON list of the findings raised for the differences, which must all be closed before signing. */
  declare findingIds: CreationOptional<string | null>;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    const longText = (allowNull: boolean) => ({ type: DataTypes.TEXT('long'), allowNull });
    IndependentModel.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        checkerId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        input: longText(false),
        result: longText(true),
        checklist: longText(true),
        verdict: { type: DataTypes.STRING(20), allowNull: true },
        lockedAt: { type: DataTypes.DATE(3), allowNull: true },
        modelHash: { type: DataTypes.CHAR(64), allowNull: true },
        authorHash: { type: DataTypes.CHAR(64), allowNull: true },
        comparison: longText(true),
        agrees: { type: DataTypes.BOOLEAN, allowNull: true },
        findingIds: { type: DataTypes.TEXT, allowNull: true },
        lockVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'independent_models', underscored: true },
    );
  }
}
