import { AbilityBuilder, PureAbility, fieldPatternMatcher, type RawRuleOf, type ForcedSubject } from '@casl/ability';
import type { Role } from './roles';
import { conditionsMatcher, type RestrictedConditions } from './restricted-conditions';
import { defineWorkflowRules } from '../workflow/workflow-abilities';

export const ACTIONS = [
  'read',
  'create',
  'update',
  'deactivate',
  'assignRoles',
  'changePassword',
  'submit',
  'check',
  'return',
  'approve',
  'sign',
  'audit',
  'publish',
  'impact',
  'confirm',
] as const;
export const SUBJECTS = [
  'User',
  'Project',
  'Calc',
  'Revision',
  'RuleSet',
  'AuditEvent',
  'SentMail',
  'RoleGrant',
  'ReviewHealth',
  'HealthSettings',
  'all',
] as const;
export type Action = (typeof ACTIONS)[number];
export type SubjectName = (typeof SUBJECTS)[number];
type Subjects = SubjectName | ForcedSubject<Exclude<SubjectName, 'all'>>;

export type AppAbility = PureAbility<[Action, Subjects], RestrictedConditions>;
export type AppRawRule = RawRuleOf<AppAbility>;

/** What the rules need to know about the signed-in person. */
export interface AbilityUser {
  id: number;
  roles: readonly Role[];
}

type Builder = AbilityBuilder<AppAbility>;

const RULES_BY_ROLE: Record<Role, (user: AbilityUser, b: Builder) => void> = {
  author(user, { can }) {
    can('read', ['Calc', 'Revision', 'RuleSet']);
    can('create', 'Calc');
  },
  checker(user, { can }) {
    can('read', ['Calc', 'Revision', 'RuleSet']);
  },
  approver(user, { can }) {
    can('read', ['Calc', 'Revision', 'RuleSet']);
  },
  compliance(user, { can }) {
    can('read', ['Project', 'Calc', 'Revision', 'RuleSet', 'AuditEvent']);
    can(['create', 'update'], 'RuleSet', { status: 'draft' });
    can(['publish', 'impact'], 'RuleSet');
    can('audit', 'all');
    reviewHealth(can);
    secondPersonForRoles(user, can);
  },
  admin(user, { can }) {
    // Admins manage people and projects; field lists keep passwords out of their reach.
    can('read', ['User', 'Project', 'AuditEvent', 'SentMail']);
    can('create', ['User', 'Project']);
    can('update', 'User', ['displayName', 'email', 'active', 'secondFactorRequired']);
    // Nobody changes their own roles; a signing role given to someone else waits for a second person.
    can('update', 'User', ['roles'], { id: { $ne: user.id } });
    can('assignRoles', 'User', { id: { $ne: user.id } });
    can('deactivate', 'User');
    can('update', 'Project');
    // Admins already read every audit entry behind the review-health signals, so they may see the signals too.
    reviewHealth(can);
    secondPersonForRoles(user, can);
  },
};

/** Review-health signals and their thresholds (issue 15): compliance and admins, audited on change. */
function reviewHealth(can: Builder['can']): void {
  can('read', 'ReviewHealth');
  can(['read', 'update'], 'HealthSettings');
}

/** Admins and compliance confirm or refuse role requests made by someone else for someone else. */
function secondPersonForRoles(user: AbilityUser, can: Builder['can']): void {
  can('read', 'RoleGrant');
  can('confirm', 'RoleGrant', { requestedBy: { $ne: user.id }, userId: { $ne: user.id } });
}

/** The one place permissions are defined; the server enforces them and the client mirrors them. */
export function defineRulesFor(user: AbilityUser | null | undefined): AppRawRule[] {
  const builder = new AbilityBuilder<AppAbility>(PureAbility);
  if (!user) return builder.rules;
  builder.can('read', 'User', { id: user.id });
  builder.can('changePassword', 'User', { id: user.id });
  // Archived projects stay visible to compliance and admins (audits, records), not in daily work.
  builder.can('read', 'Project', { status: 'active' });
  for (const role of user.roles) {
    const define = RULES_BY_ROLE[role];
    if (!define) throw new Error(`Unknown role "${String(role)}"`);
    define(user, builder);
    // What a role may do to a revision comes from the workflow table (shared/workflow/revision-states.ts).
    defineWorkflowRules(role, user, builder.can);
  }
  return builder.rules;
}

export function createAppAbility(rules: AppRawRule[] = []): AppAbility {
  return new PureAbility<[Action, Subjects], RestrictedConditions>(rules, {
    conditionsMatcher: conditionsMatcher as never,
    fieldMatcher: fieldPatternMatcher,
  });
}
