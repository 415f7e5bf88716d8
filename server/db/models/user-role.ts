import { Model, DataTypes, type Sequelize, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { ROLES, type Role } from '../../../shared/authz/roles';

export class UserRole extends Model<InferAttributes<UserRole>, InferCreationAttributes<UserRole>> {
  declare userId: number;
  declare role: Role;

  static initModel(sequelize: Sequelize): void {
    UserRole.init(
      {
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        role: { type: DataTypes.ENUM(...ROLES), primaryKey: true },
      },
      { sequelize, tableName: 'user_roles', underscored: true, timestamps: false },
    );
  }
}
