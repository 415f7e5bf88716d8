import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

export type SignatureMeaning = 'authored' | 'checked' | 'approved';

/** An e-signature: who, in which role, meaning what, when (database UTC), over which content hash. */
export class Signature extends Model<InferAttributes<Signature>, InferCreationAttributes<Signature>> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare userId: number;
  declare printedName: string;
  declare role: string;
  declare meaning: SignatureMeaning;
  declare signedAt: Date;
  declare contentHash: string;
  /** Content format the hash was made in (server/calcs/revision-content.ts); 1 = before attachments were signed. */
  declare contentFormat: number;
  /** JSON list of the attachments the signature covered (format 2), null for format 1. */
  declare attachments: string | null;
  declare idempotencyKey: string;

  static initModel(sequelize: Sequelize): void {
    Signature.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        printedName: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.STRING(20), allowNull: false },
        meaning: { type: DataTypes.ENUM('authored', 'checked', 'approved'), allowNull: false },
        signedAt: { type: DataTypes.DATE(3), allowNull: false },
        contentHash: { type: DataTypes.CHAR(64), allowNull: false },
        contentFormat: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false },
        attachments: { type: DataTypes.TEXT, allowNull: true },
        idempotencyKey: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      },
      { sequelize, tableName: 'signatures', underscored: true, timestamps: false },
    );
  }
}
