import { Op, type Transaction } from 'sequelize';
import { MAIL_EVENTS, MAIL_EVENT_INFO, type MailEvent, type MailPreferenceDto } from '../../shared/schemas/mail.schema';
import type { Role } from '../../shared/authz/roles';
import { MailPreference, User } from '../db/models';
import { appendAudit, type Actor } from '../audit/audit.service';
import type { Sequelize } from 'sequelize';
import { runTransaction } from '../db/transaction';

/** Each person's choice per mail event. Without a row, the mail is sent. */
export async function preferencesOf(userId: number, roles: readonly Role[]): Promise<MailPreferenceDto[]> {
  const rows = await MailPreference.findAll({ where: { userId } });
  const chosen = new Map(rows.map((r) => [r.event, r.enabled]));
  return MAIL_EVENTS.map((event) => ({
    event,
    ...MAIL_EVENT_INFO[event],
    enabled: chosen.get(event) ?? true,
    appliesToYou: roles.includes(MAIL_EVENT_INFO[event].role),
  })).map(({ role: _role, ...dto }) => dto);
}

export async function savePreferences(
  sequelize: Sequelize,
  actor: Actor & { id: number },
  roles: readonly Role[],
  choices: Partial<Record<MailEvent, boolean>>,
): Promise<MailPreferenceDto[]> {
  await runTransaction(sequelize, async (transaction) => {
    for (const [event, enabled] of Object.entries(choices)) {
      await MailPreference.upsert({ userId: actor.id, event, enabled: enabled === true }, { transaction });
    }
    await appendAudit(
      sequelize,
      actor,
      { action: 'user.mail_preferences', entityType: 'User', entityId: actor.id, payload: choices },
      transaction,
    );
  });
  return preferencesOf(actor.id, roles);
}

/**
 * Drops addresses whose owners opted out of this event. Opt-outs are few, so they are read first
 * and the common case costs one small query. An address shared with someone who still wants the
 * mail is kept, and an outside address (no account) always is.
 */
export async function withoutOptedOut(
  recipients: string[],
  event: string,
  transaction?: Transaction,
): Promise<string[]> {
  if (recipients.length === 0) return recipients;
  const optedOut = (
    await MailPreference.findAll({ where: { event, enabled: false }, attributes: ['userId'], transaction })
  ).map((p) => p.userId);
  if (optedOut.length === 0) return recipients;
  const silent = await User.findAll({
    where: { id: { [Op.in]: optedOut }, email: { [Op.in]: recipients } },
    attributes: ['email'],
    transaction,
  });
  if (silent.length === 0) return recipients;
  const silentEmails = [...new Set(silent.map((u) => u.email))];
  const stillWanted = await User.findAll({
    where: { email: { [Op.in]: silentEmails }, active: true, id: { [Op.notIn]: optedOut } },
    attributes: ['email'],
    transaction,
  });
  const keep = new Set(stillWanted.map((u) => u.email));
  return recipients.filter((address) => !silentEmails.includes(address) || keep.has(address));
}
