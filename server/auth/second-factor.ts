import { authenticator } from 'otplib';
import type { Sequelize } from 'sequelize';
import type { SecondFactorEnrolment, SecondFactorStatus } from '../../shared/schemas/second-factor.schema';
import { User } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { verifyPassword } from './password';
import { runTransaction } from '../db/transaction';

// One step either side of the current 30-second window absorbs clock drift on phones.
authenticator.options = { window: 1 };

/** Why a signature's one-time code is refused; each reason is its own audit entry and its own message. */
export type SecondFactorRefusal = 'one-time code not set up' | 'one-time code missing' | 'one-time code wrong';

/** The refusal of a signer's one-time code, if any: required but not set up, missing, or wrong (or expired). */
export function secondFactorRefusal(
  user: User,
  code: string | undefined,
): { reason: SecondFactorRefusal; error: AppError } | null {
  if (!user.totpSecret) {
    if (!user.totpRequired) return null;
    return {
      reason: 'one-time code not set up',
      error: new AppError(
        'second_factor_required',
        403,
        'An administrator requires a one-time code for your signatures: enrol an authenticator app under Your account first',
      ),
    };
  }
  const refused = (reason: SecondFactorRefusal, problem: string) => ({
    reason,
    error: new AppError('validation', 400, `One-time code ${problem}; nothing was signed`, {
      fieldErrors: { oneTimeCode: [problem] },
    }),
  });
  if (!code) return refused('one-time code missing', 'is required: enter the 6 digits your authenticator app shows');
  if (!authenticator.check(code, user.totpSecret))
    return refused('one-time code wrong', 'is not correct or has expired');
  return null;
}

/**
 * Enrolment of a time-based one-time code (RFC 6238) for signatures. The secret is held in the
 * session until the person proves their app produces matching codes; only then is it stored.
 */
export class SecondFactorService {
  constructor(private readonly sequelize: Sequelize) {}

  async status(userId: number): Promise<SecondFactorStatus> {
    const user = await User.scope('withPassword').findByPk(userId);
    return { enrolled: !!user?.totpSecret, required: !!user?.totpRequired };
  }

  async begin(
    actor: Actor & { id: number },
    username: string,
  ): Promise<{ secret: string; enrolment: SecondFactorEnrolment }> {
    const secret = authenticator.generateSecret();
    const otpauthUrl = authenticator.keyuri(username, 'Torquetrail', secret);
    return {
      secret,
      enrolment: { otpauthUrl, secret, qrDataUrl: await qrDataUrl(otpauthUrl) },
    };
  }

  async confirm(
    actor: Actor & { id: number },
    pendingSecret: string | undefined,
    code: string,
  ): Promise<SecondFactorStatus> {
    if (!pendingSecret)
      throw AppError.conflict('Start the enrolment again: no code set-up is in progress in this session');
    if (!authenticator.check(code, pendingSecret))
      throw AppError.validation({ code: ['does not match: check the time on your phone and try the next code'] });
    await runTransaction(this.sequelize, async (transaction) => {
      await User.update({ totpSecret: pendingSecret }, { where: { id: actor.id }, transaction });
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'auth.second_factor_enrolled', entityType: 'User', entityId: actor.id },
        transaction,
      );
    });
    return this.status(actor.id);
  }

  async disable(actor: Actor & { id: number }, password: string): Promise<SecondFactorStatus> {
    const user = await User.scope('withPassword').findByPk(actor.id);
    if (!user || !(await verifyPassword(user.passwordHash, password)))
      throw AppError.validation({ password: ['is not correct'] });
    if (user.totpRequired)
      throw AppError.conflict(
        'An administrator requires a one-time code for your signatures; it cannot be switched off',
      );
    await runTransaction(this.sequelize, async (transaction) => {
      await User.update({ totpSecret: null }, { where: { id: actor.id }, transaction });
      await appendAudit(
        this.sequelize,
        actor,
        { action: 'auth.second_factor_removed', entityType: 'User', entityId: actor.id },
        transaction,
      );
    });
    return this.status(actor.id);
  }
}

/** The enrolment QR code as a data URL; qrcode is loaded on first enrolment, not with the server (issue 14). */
async function qrDataUrl(text: string): Promise<string> {
  const { default: QRCode } = await import('qrcode');
  return QRCode.toDataURL(text, { margin: 1, width: 220 });
}
