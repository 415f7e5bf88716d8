import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';
import { ROLES, type Role } from '../../../shared/authz/roles';
import { GRANT_STATUSES, type GrantStatus } from '../../../shared/schemas/role-grant.schema';

/** A request to give someone a signing role, and the second person's decision on it. */
export class RoleGrant extends Model<InferAttributes<RoleGrant>, InferCreationAttributes<RoleGrant>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare role: Role;
  declare status: CreationOptional<GrantStatus>;
  declare requestedBy: number;
  declare decidedBy: CreationOptional<number | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    RoleGrant.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        status: { type: DataTypes.ENUM(...GRANT_STATUSES), allowNull: false, defaultValue: 'pending' },
        requestedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        decidedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'role_grants', underscored: true },
    );
  }
}
