import type { Transaction } from 'sequelize';
import { ROLE_LABELS, type Role } from '../../shared/authz/roles';
import { enqueueMail, emailsOfRole } from '../mail/outbox';

export type RoleChange = 'requested' | 'granted' | 'refused' | 'withdrawn' | 'removed';

const HEADLINES: Record<RoleChange, (role: string, who: string, by: string) => string> = {
  requested: (role, who, by) =>
    `${by} asked for ${who} to be given the ${role} role. It takes effect only when a second administrator or compliance officer confirms it.`,
  granted: (role, who, by) => `${who} now holds the ${role} role (${by}).`,
  refused: (role, who, by) => `${by} refused the request to give ${who} the ${role} role.`,
  withdrawn: (role, who, by) => `${by} withdrew the request to give ${who} the ${role} role.`,
  removed: (role, who, by) => `${by} removed the ${role} role from ${who}.`,
};

/**
 * Every grant and removal of a role reaches the compliance officers. It is a record, not a
 * hand-over, so nobody can opt out of it (its event is not among the mail preferences).
 */
export async function queueRoleChangeMail(
  change: RoleChange,
  role: Role,
  who: string,
  by: string,
  transaction: Transaction,
  reason?: string,
): Promise<void> {
  const label = ROLE_LABELS[role];
  const body = [
    HEADLINES[change](label, who, by),
    ...(reason ? ['', `Reason: ${reason}`] : []),
    '',
    change === 'requested'
      ? 'Confirm or refuse it under People and roles (administrators) or Role confirmations (compliance).'
      : 'The change is on the audit trail.',
  ].join('\n');
  await enqueueMail(
    await emailsOfRole('compliance', [], transaction),
    {
      event: 'role_change',
      subject: `Role ${change}: ${label} — ${who}`,
      body,
    },
    transaction,
  );
}
