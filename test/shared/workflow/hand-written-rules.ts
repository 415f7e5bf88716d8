import { AbilityBuilder, PureAbility } from '@casl/ability';
import type { AbilityUser, AppAbility, AppRawRule } from '../../../shared/authz/app-ability';
import type { Role } from '../../../shared/authz/roles';

type Builder = AbilityBuilder<AppAbility>;

/**
 * The abilities as they were written by hand before the workflow table existed, kept frozen so
 * the rules derived from the table can be held equal to them (workflow-abilities.spec.ts).
 * A frozen copy BY DESIGN: the rules that are not revision rules (compliance, admin, review health,
 * role grants) repeat shared/authz/app-ability.ts line for line, and the duplicates tool lists the pair.
 * Do not import them from there: the spec would then compare the code under test with itself.
 * When app-ability.ts gains such a rule on purpose, copy it here in the same change.
 */
const RULES_BY_ROLE: Record<Role, (user: AbilityUser, b: Builder) => void> = {
  author(user, { can }) {
    can('read', ['Calc', 'Revision', 'RuleSet']);
    can('create', 'Calc');
    can(['update', 'submit'], 'Revision', { authorId: user.id, status: { $in: ['draft', 'returned'] } });
    can('sign', 'Revision', { authorId: user.id, status: { $in: ['draft', 'returned'] } });
  },
  checker(user, { can }) {
    can('read', ['Calc', 'Revision', 'RuleSet']);
    can(['check', 'return', 'sign'], 'Revision', { status: 'in_check', authorId: { $ne: user.id } });
  },
  approver(user, { can }) {
    can('read', ['Calc', 'Revision', 'RuleSet']);
    can(['approve', 'return', 'sign'], 'Revision', {
      status: 'checked',
      authorId: { $ne: user.id },
      checkerId: { $ne: user.id },
    });
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
    can('read', ['User', 'Project', 'AuditEvent', 'SentMail']);
    can('create', ['User', 'Project']);
    can('update', 'User', ['displayName', 'email', 'active', 'secondFactorRequired']);
    can('update', 'User', ['roles'], { id: { $ne: user.id } });
    can('assignRoles', 'User', { id: { $ne: user.id } });
    can('deactivate', 'User');
    can('update', 'Project');
    reviewHealth(can);
    secondPersonForRoles(user, can);
  },
};

// Added with the review-health signals (not revision rules, so not derived from the workflow table).
function reviewHealth(can: Builder['can']): void {
  can('read', 'ReviewHealth');
  can(['read', 'update'], 'HealthSettings');
}

function secondPersonForRoles(user: AbilityUser, can: Builder['can']): void {
  can('read', 'RoleGrant');
  can('confirm', 'RoleGrant', { requestedBy: { $ne: user.id }, userId: { $ne: user.id } });
}

export function handWrittenRulesFor(user: AbilityUser): AppRawRule[] {
  const builder = new AbilityBuilder<AppAbility>(PureAbility);
  builder.can('read', 'User', { id: user.id });
  builder.can('changePassword', 'User', { id: user.id });
  builder.can('read', 'Project', { status: 'active' });
  for (const role of user.roles) RULES_BY_ROLE[role](user, builder);
  return builder.rules;
}
