import type { Sequelize, Transaction } from 'sequelize';
import type { Role } from '../../shared/authz/roles';
import type { User } from '../db/models';
import { appendAudit, type Actor } from '../audit/audit.service';
import { queueRoleChangeMail, type RoleChange } from './role-change-mail';

const AUDIT_ACTIONS: Record<RoleChange, string> = {
  requested: 'user.role_requested',
  granted: 'user.role_granted',
  refused: 'user.role_refused',
  withdrawn: 'user.role_request_withdrawn',
  removed: 'user.role_removed',
};

/** One step in a person's roles: `grantId` names the request when there is one. */
export interface RoleChangeFacts {
  change: RoleChange;
  user: User;
  role: Role;
  grantId: number | null;
  reason?: string;
}

/** Every role step goes on the audit trail and into the compliance officers' mail, in the same transaction. */
export async function recordRoleChange(
  sequelize: Sequelize,
  actor: Actor,
  { change, user, role, grantId, reason }: RoleChangeFacts,
  transaction: Transaction,
): Promise<void> {
  await appendAudit(
    sequelize,
    actor,
    {
      action: AUDIT_ACTIONS[change],
      entityType: 'User',
      entityId: user.id,
      payload: {
        username: user.username,
        role,
        ...(grantId ? { request: grantId } : {}),
        ...(reason ? { reason } : {}),
      },
    },
    transaction,
  );
  await queueRoleChangeMail(change, role, `${user.displayName} (${user.username})`, actor.name, transaction, reason);
}
