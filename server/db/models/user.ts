import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
  type NonAttribute,
} from 'sequelize';
import type { Role } from '../../../shared/authz/roles';
import type { UserRole } from './user-role';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare username: string;
  declare displayName: string;
  declare email: string;
  declare passwordHash: string;
  declare active: CreationOptional<boolean>;
  declare lastSignInAt: CreationOptional<Date | null>;
  declare passwordChangedAt: CreationOptional<Date | null>;
  declare totpSecret: CreationOptional<string | null>;
  declare totpRequired: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare roleRows?: NonAttribute<UserRole[]>;

  get roles(): NonAttribute<Role[]> {
    return (this.roleRows ?? []).map((r) => r.role).sort();
  }

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        username: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        displayName: { type: DataTypes.STRING(120), allowNull: false },
        email: { type: DataTypes.STRING(190), allowNull: false },
        passwordHash: { type: DataTypes.STRING(255), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        lastSignInAt: { type: DataTypes.DATE(3), allowNull: true },
        passwordChangedAt: { type: DataTypes.DATE(3), allowNull: true },
        totpSecret: { type: DataTypes.STRING(64), allowNull: true },
        totpRequired: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      {
        sequelize,
        tableName: 'users',
        underscored: true,
        version: true,
        // The hash never leaves the data layer unless a caller asks for it by scope.
        defaultScope: { attributes: { exclude: ['passwordHash', 'totpSecret'] } },
        // An empty scope replaces the default one, so every column comes back once; `include`
        // here would list password_hash twice, which the mariadb driver rejects.
        scopes: { withPassword: {} },
      },
    );
  }
}
