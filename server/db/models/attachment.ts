import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';
import { ATTACHMENT_KINDS, type AttachmentKind } from '../../../shared/schemas/attachment.schema';

/** A file attached to a revision; the bytes are in object storage under `storageKey` (their SHA-256). */
export class Attachment extends Model<InferAttributes<Attachment>, InferCreationAttributes<Attachment>> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare kind: AttachmentKind;
  declare fileName: string;
  declare mediaType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare storageKey: string;
  declare note: CreationOptional<string>;
  declare uploadedBy: number;
  declare uploadedByName: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Attachment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM(...ATTACHMENT_KINDS), allowNull: false },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        mediaType: { type: DataTypes.STRING(120), allowNull: false },
        // BIGINT comes back as a string from the driver; the getter keeps the attribute a number.
        sizeBytes: {
          type: DataTypes.BIGINT.UNSIGNED,
          allowNull: false,
          get() {
            return Number(this.getDataValue('sizeBytes'));
          },
        },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        storageKey: { type: DataTypes.STRING(200), allowNull: false },
        note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        uploadedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        uploadedByName: { type: DataTypes.STRING(120), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'attachments', underscored: true, updatedAt: false },
    );
  }
}
