import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
  type NonAttribute,
} from 'sequelize';
import type { RuleSetRecord } from './rule-set-record';
import type { User } from './user';
import { REVISION_STATES, type RevisionState } from '../../../shared/schemas/revision.schema';

/**
 * A revision of a calc: the author's input and the server's record of truth computed from it
 * (engine result, checklist, verdict, content hash). `lockVersion` guards concurrent saves.
 */
export class Revision extends Model<InferAttributes<Revision>, InferCreationAttributes<Revision>> {
  declare id: CreationOptional<number>;
  declare calcId: number;
  declare seq: number;
  declare label: string;
  declare status: CreationOptional<RevisionState>;
  declare authorId: number;
  declare checkerId: CreationOptional<number | null>;
  declare approverId: CreationOptional<number | null>;
  declare ruleSetId: number;
  declare input: string;
  declare result: string | null;
  declare checklist: string | null;
  declare manualItems: string;
  declare verdict: string | null;
  /** Compact verdict and failing mandatory rows (shared/schemas/outcome.ts), for bulk comparison. */
  declare outcome: CreationOptional<string | null>;
  declare contentHash: string | null;
  /** What the content hash covers: 1 = before attachments were signed, 2 = with the attachment set. */
  declare contentFormat: CreationOptional<number>;
  declare reasonForChange: string;
  declare lockVersion: CreationOptional<number>;
  declare submittedAt: CreationOptional<Date | null>;
  declare checkedAt: CreationOptional<Date | null>;
  declare approvedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare ruleSet?: NonAttribute<RuleSetRecord>;
  declare author?: NonAttribute<User>;
  declare checker?: NonAttribute<User | null>;
  declare approver?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    const longText = (allowNull: boolean) => ({ type: DataTypes.TEXT('long'), allowNull });
    // A fresh object per attribute: Sequelize writes the column name into each definition, so a shared one maps all
    // three to one column.
    const when = () => ({ type: DataTypes.DATE(3), allowNull: true });
    const userRef = (allowNull: boolean) => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull });
    Revision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        calcId: userRef(false),
        seq: userRef(false),
        label: { type: DataTypes.STRING(8), allowNull: false },
        status: { type: DataTypes.ENUM(...REVISION_STATES), allowNull: false, defaultValue: 'draft' },
        authorId: userRef(false),
        checkerId: userRef(true),
        approverId: userRef(true),
        ruleSetId: userRef(false),
        input: longText(false),
        result: longText(true),
        checklist: longText(true),
        manualItems: longText(false),
        verdict: { type: DataTypes.STRING(20), allowNull: true },
        outcome: { type: DataTypes.TEXT, allowNull: true },
        contentHash: { type: DataTypes.CHAR(64), allowNull: true },
        contentFormat: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 2 },
        reasonForChange: { type: DataTypes.TEXT, allowNull: false },
        lockVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        submittedAt: when(),
        checkedAt: when(),
        approvedAt: when(),
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'revisions', underscored: true },
    );
  }
}
