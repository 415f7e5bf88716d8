import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';
import { PROJECT_STATUSES, REVISION_SCHEMES } from '../../../shared/schemas/project.schema';

export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  declare client: CreationOptional<string>;
  declare description: CreationOptional<string>;
  declare revisionScheme: CreationOptional<(typeof REVISION_SCHEMES)[number]>;
  declare status: CreationOptional<(typeof PROJECT_STATUSES)[number]>;
  declare createdBy: number | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Project.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(32), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        client: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        revisionScheme: { type: DataTypes.ENUM(...REVISION_SCHEMES), allowNull: false, defaultValue: 'letters' },
        status: { type: DataTypes.ENUM(...PROJECT_STATUSES), allowNull: false, defaultValue: 'active' },
        createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'projects', underscored: true, version: true },
    );
  }
}
