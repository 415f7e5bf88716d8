import type { Sequelize } from 'sequelize';
import { User } from './user';
import { UserRole } from './user-role';
import { Project } from './project';
import { AuditEvent } from './audit-event';
import { Session } from './session';

export { User, UserRole, Project, AuditEvent, Session };

/** Initialise every model once, then wire associations in one step. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [User, UserRole, Project, AuditEvent, Session]) model.initModel(sequelize);
  User.hasMany(UserRole, { as: 'roleRows', foreignKey: 'userId' });
  UserRole.belongsTo(User, { foreignKey: 'userId' });
}
