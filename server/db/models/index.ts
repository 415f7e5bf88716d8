import type { Sequelize } from 'sequelize';
import { User } from './user';
import { UserRole } from './user-role';
import { Project } from './project';
import { AuditEvent } from './audit-event';
import { Session } from './session';
import { RuleSetRecord } from './rule-set-record';
import { Calc, CalcEditor } from './calc';
import { Revision } from './revision';
import { Finding } from './finding';
import { Signature } from './signature';
import { MailOutbox } from './mail-outbox';
import { MailPreference } from './mail-preference';
import { Attachment } from './attachment';
import { RoleGrant } from './role-grant';
import { IndependentModel } from './independent-model';
import { ReviewHealthSettings } from './review-health-settings';

export {
  User,
  UserRole,
  Project,
  AuditEvent,
  Session,
  RuleSetRecord,
  Calc,
  CalcEditor,
  Revision,
  Finding,
  Signature,
  MailOutbox,
  MailPreference,
  Attachment,
  RoleGrant,
  IndependentModel,
  ReviewHealthSettings,
};

const MODELS = [
  User,
  UserRole,
  Project,
  AuditEvent,
  Session,
  RuleSetRecord,
  Calc,
  CalcEditor,
  Revision,
  Finding,
  Signature,
  MailOutbox,
  MailPreference,
  Attachment,
  RoleGrant,
  IndependentModel,
  ReviewHealthSettings,
];

/** Initialise every model once, then wire associations in one step. */
export function initModels(sequelize: Sequelize): void {
  for (const model of MODELS) model.initModel(sequelize);
  User.hasMany(UserRole, { as: 'roleRows', foreignKey: 'userId' });
  UserRole.belongsTo(User, { foreignKey: 'userId' });
  Project.hasMany(Calc, { foreignKey: 'projectId' });
  Calc.belongsTo(Project, { foreignKey: 'projectId' });
  Calc.hasMany(Revision, { as: 'revisions', foreignKey: 'calcId' });
  Revision.belongsTo(Calc, { foreignKey: 'calcId' });
  Revision.belongsTo(RuleSetRecord, { as: 'ruleSet', foreignKey: 'ruleSetId' });
  Revision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Revision.belongsTo(User, { as: 'checker', foreignKey: 'checkerId' });
  Revision.belongsTo(User, { as: 'approver', foreignKey: 'approverId' });
  Revision.hasMany(Finding, { as: 'findings', foreignKey: 'revisionId' });
  Revision.hasMany(Signature, { as: 'signatures', foreignKey: 'revisionId' });
}
