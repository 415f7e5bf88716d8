import { subject } from '@casl/ability';
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import { SIGNING_ROLES, type Role } from '../../shared/authz/roles';
import type { RoleGrantDto } from '../../shared/schemas/role-grant.schema';
import { RoleGrant, User, UserRole } from '../db/models';
import { AppError } from '../errors/app-error';
import type { Actor } from '../audit/audit.service';
import { runTransaction } from '../db/transaction';
import { verifyPassword } from '../auth/password';
import { recordRoleChange, type RoleChangeFacts } from './role-change-record';
import { toRoleGrantDtos } from './role-grant-dto';
import { forbiddenCheck } from '../authz/forbidden-check';

type Person = Actor & { id: number };

/**
 * Separation of duties for roles. Removing a role takes effect at once (it only takes power
 * away); giving a signing role waits for a second person, who is neither the requester nor the
 * grantee. Every step is on the audit trail and in the compliance officers' mail.
 */
export class RoleGrantsService {
  constructor(private readonly sequelize: Sequelize) {}

  /** Moves `user` (locked by the caller) towards `desired`; returns whether anything changed. */
  async changeRoles(actor: Person, user: User, desired: readonly Role[], transaction: Transaction): Promise<boolean> {
    const current = new Set(user.roles);
    const pending = await RoleGrant.findAll({ where: { userId: user.id, status: 'pending' }, transaction });
    const pendingRoles = new Set(pending.map((g) => g.role));
    let changed = false;
    for (const role of current) {
      if (desired.includes(role)) continue;
      await UserRole.destroy({ where: { userId: user.id, role }, transaction });
      await this.record(actor, { change: 'removed', user, role, grantId: null }, transaction);
      changed = true;
    }
    for (const grant of pending.filter((g) => !desired.includes(g.role))) {
      await grant.update({ status: 'withdrawn', decidedBy: actor.id, decidedAt: new Date() }, { transaction });
      await this.record(actor, { change: 'withdrawn', user, role: grant.role, grantId: grant.id }, transaction);
    }
    for (const role of desired.filter((r) => !current.has(r) && !pendingRoles.has(r))) {
      if (SIGNING_ROLES.includes(role)) {
        const grant = await RoleGrant.create({ userId: user.id, role, requestedBy: actor.id }, { transaction });
        await this.record(actor, { change: 'requested', user, role, grantId: grant.id }, transaction);
      } else {
        await UserRole.create({ userId: user.id, role }, { transaction });
        await this.record(actor, { change: 'granted', user, role, grantId: null }, transaction);
        changed = true;
      }
    }
    return changed;
  }

  async listPending(ability: AppAbility): Promise<RoleGrantDto[]> {
    forbiddenCheck(ability)
      .setMessage('Role confirmations are for administrators and compliance')
      .throwUnlessCan('read', 'RoleGrant');
    const grants = await RoleGrant.findAll({
      where: { status: 'pending' },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    return toRoleGrantDtos(grants);
  }

  async pendingRolesOf(userIds: number[]): Promise<Map<number, Role[]>> {
    const rows = userIds.length
      ? await RoleGrant.findAll({ where: { userId: { [Op.in]: userIds }, status: 'pending' } })
      : [];
    const out = new Map<number, Role[]>();
    for (const g of rows) out.set(g.userId, [...(out.get(g.userId) ?? []), g.role].sort());
    return out;
  }

  /** The second person's confirmation, with their password: the role takes effect. */
  async confirm(ability: AppAbility, actor: Person, grantId: number, password: string): Promise<RoleGrantDto> {
    const me = await User.scope('withPassword').findByPk(actor.id);
    if (!me || !(await verifyPassword(me.passwordHash, password))) {
      throw new AppError('validation', 400, 'Password is not correct; nothing was confirmed', {
        fieldErrors: { password: ['is not correct'] },
      });
    }
    return this.decide(ability, actor, grantId, 'confirmed');
  }

  async refuse(ability: AppAbility, actor: Person, grantId: number, reason: string): Promise<RoleGrantDto> {
    return this.decide(ability, actor, grantId, 'refused', reason);
  }

  private record(actor: Person, facts: RoleChangeFacts, transaction: Transaction): Promise<void> {
    return recordRoleChange(this.sequelize, actor, facts, transaction);
  }

  private async decide(
    ability: AppAbility,
    actor: Person,
    grantId: number,
    status: 'confirmed' | 'refused',
    reason?: string,
  ): Promise<RoleGrantDto> {
    const found = await RoleGrant.findByPk(grantId);
    if (!found) throw AppError.notFound(`Role request ${grantId}`);
    await runTransaction(this.sequelize, async (transaction) => {
      const { user, grant } = await lockPersonAndGrant(found.userId, grantId, transaction);
      assertMayDecide(ability, actor, grant);
      if (grant.status !== 'pending') throw AppError.conflict(`This request was already ${grant.status}`);
      await grant.update({ status, decidedBy: actor.id, decidedAt: new Date() }, { transaction });
      if (status === 'confirmed') {
        await UserRole.findOrCreate({ where: { userId: user.id, role: grant.role }, transaction });
        // A role change is a change to the account: anyone holding the old version must reload.
        user.changed('updatedAt', true);
        await user.save({ transaction });
      }
      const change = status === 'confirmed' ? 'granted' : 'refused';
      await this.record(actor, { change, user, role: grant.role, grantId: grant.id, reason }, transaction);
    });
    const [dto] = await toRoleGrantDtos([(await RoleGrant.findByPk(grantId))!]);
    return dto;
  }
}

/** The person's row first, then the request: the same order as a role change, so the two never deadlock. */
async function lockPersonAndGrant(
  userId: number,
  grantId: number,
  transaction: Transaction,
): Promise<{ user: User; grant: RoleGrant }> {
  const user = await User.findByPk(userId, {
    include: [{ model: UserRole, as: 'roleRows' }],
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  const grant = await RoleGrant.findByPk(grantId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!user || !grant) throw AppError.notFound(`Role request ${grantId}`);
  return { user, grant };
}

function assertMayDecide(ability: AppAbility, actor: Person, grant: RoleGrant): void {
  if (grant.requestedBy === actor.id)
    throw new AppError('forbidden', 403, 'A second person must decide; you asked for this role');
  if (grant.userId === actor.id) throw new AppError('forbidden', 403, 'Nobody decides on their own roles');
  forbiddenCheck(ability)
    .setMessage('Only an administrator or compliance officer confirms roles')
    .throwUnlessCan('confirm', subject('RoleGrant', { userId: grant.userId, requestedBy: grant.requestedBy }));
}
