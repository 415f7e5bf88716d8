import { createHash } from 'node:crypto';
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { ActiveSessionDto } from '../../shared/schemas/session-list.schema';
import { Session } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { runTransaction } from '../db/transaction';

/** The id shown for a session. Never the session id itself: that is the bearer credential. */
export function publicSessionId(sid: string): string {
  return createHash('sha256').update(`session:${sid}`).digest('hex').slice(0, 32);
}

/** A person's own sessions: listing them, ending one, ending all but the current one. */
export class SessionsService {
  constructor(private readonly sequelize: Sequelize) {}

  async list(userId: number, currentSid: string): Promise<ActiveSessionDto[]> {
    const rows = await Session.findAll({
      where: { userId, expires: { [Op.gt]: new Date() } },
      order: [['updatedAt', 'DESC']],
    });
    return rows.map((row) => ({
      id: publicSessionId(row.sid),
      startedAt: row.createdAt.toISOString(),
      lastSeenAt: row.updatedAt.toISOString(),
      ip: row.ip,
      userAgent: row.userAgent,
      current: row.sid === currentSid,
    }));
  }

  async end(actor: Actor & { id: number }, currentSid: string, publicId: string): Promise<void> {
    await runTransaction(this.sequelize, async (transaction) => {
      const rows = await Session.findAll({ where: { userId: actor.id }, attributes: ['sid'], transaction });
      const row = rows.find((r) => publicSessionId(r.sid) === publicId);
      if (!row) throw AppError.notFound('That session');
      if (row.sid === currentSid)
        throw new AppError('current_session', 400, 'This is the session you are using; sign out to end it');
      await Session.destroy({ where: { sid: row.sid }, transaction });
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'auth.session_ended', entityType: 'User', entityId: actor.id, payload: { session: publicId } },
        transaction,
      );
    });
  }

  /** Ends every other session of the person (after a password change); returns how many. */
  async endOthers(userId: number, currentSid: string, transaction: Transaction): Promise<number> {
    return Session.destroy({ where: { userId, sid: { [Op.ne]: currentSid } }, transaction });
  }
}
