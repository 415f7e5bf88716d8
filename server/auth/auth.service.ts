import type { Sequelize } from 'sequelize';
import { subject } from '@casl/ability';
import type { AppAbility } from '../../shared/authz/app-ability';
import { User } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { hashPassword, verifyPassword } from './password';
import { SessionsService } from './sessions.service';
import { runTransaction } from '../db/transaction';
import { forbiddenCheck } from '../authz/forbidden-check';

/** Sign-in bookkeeping and the user's own password change. */
export class AuthService {
  constructor(private readonly sequelize: Sequelize) {}

  /** The sign-in's audit entry and last-sign-in time, together or not at all. */
  async recordSignIn(actor: Actor & { id: number }): Promise<void> {
    await runTransaction(this.sequelize, async (transaction) => {
      await User.update({ lastSignInAt: new Date() }, { where: { id: actor.id }, transaction });
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'auth.signed_in', entityType: 'User', entityId: actor.id },
        transaction,
      );
    });
  }

  async recordFailedSignIn(username: string, ip: string | null, reason: string): Promise<void> {
    // The attempted username is recorded for the auditor, never echoed to the client.
    await appendAudit(
      this.sequelize,
      { id: null, name: 'anonymous', ip },
      {
        action: 'auth.sign_in_failed',
        entityType: 'User',
        entityId: null,
        payload: { username: username.slice(0, 64), reason },
      },
    );
  }

  async recordSignOut(actor: Actor): Promise<void> {
    await appendAudit(this.sequelize, actor, { action: 'auth.signed_out', entityType: 'User', entityId: actor.id });
  }

  async changePassword(
    ability: AppAbility,
    actor: Actor & { id: number },
    current: string,
    next: string,
    currentSid: string,
  ): Promise<void> {
    forbiddenCheck(ability).throwUnlessCan('changePassword', subject('User', { id: actor.id }));
    const user = await User.scope('withPassword').findByPk(actor.id);
    if (!user) throw AppError.notFound('Your account');
    if (!(await verifyPassword(user.passwordHash, current))) {
      throw new AppError('validation', 400, 'Current password is not correct', {
        fieldErrors: { currentPassword: ['is not correct'] },
      });
    }
    if (current === next) {
      throw new AppError('validation', 400, 'New password must differ from the current one', {
        fieldErrors: { newPassword: ['must differ from the current one'] },
      });
    }
    const passwordHash = await hashPassword(next);
    await runTransaction(this.sequelize, async (transaction) => {
      await User.update({ passwordHash, passwordChangedAt: new Date() }, { where: { id: actor.id }, transaction });
      const endedSessions = await new SessionsService(this.sequelize).endOthers(actor.id, currentSid, transaction);
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'auth.password_changed', entityType: 'User', entityId: actor.id, payload: { endedSessions } },
        transaction,
      );
    });
  }
}
