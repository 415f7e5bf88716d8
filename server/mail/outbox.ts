import { Op, type Transaction } from 'sequelize';
import type { Role } from '../../shared/authz/roles';
import { MailOutbox, User, UserRole } from '../db/models';
import { withoutOptedOut } from './preferences.service';

export interface HandOverMail {
  event: string;
  subject: string;
  body: string;
}

/**
 * Queues a hand-over mail in the caller's transaction: it is sent if and only if the hand-over
 * commits, and a sender delivers it later, so a mail server outage never blocks the workflow.
 * People who opted out of this event (their mail preferences) are left out here.
 */
export async function enqueueMail(recipients: string[], mail: HandOverMail, transaction: Transaction): Promise<void> {
  const unique = await withoutOptedOut([...new Set(recipients.filter(Boolean))], mail.event, transaction);
  if (unique.length === 0) return;
  const now = new Date();
  const subject = fitSubject(mail.subject);
  await MailOutbox.bulkCreate(
    unique.map((recipient) => ({ ...mail, subject, recipient, nextAttemptAt: now })),
    { transaction },
  );
}

/** The outbox column and what mail programs show: longer subjects end with "…"; the body always has the full text. */
export const SUBJECT_MAX = 250;

export function fitSubject(subject: string): string {
  const chars = [...subject];
  if (chars.length <= SUBJECT_MAX) return subject;
  const cut = chars.slice(0, SUBJECT_MAX - 1).join('');
  const atWord = cut.replace(/\s+\S*$/, '');
  return `${atWord.length > SUBJECT_MAX - 40 ? atWord : cut}…`;
}

/** Active people holding a role, except those listed (e.g. the calc's own editors). */
export async function emailsOfRole(role: Role, excludeIds: number[], transaction?: Transaction): Promise<string[]> {
  const rows = await UserRole.findAll({
    where: { role, userId: { [Op.notIn]: excludeIds.length ? excludeIds : [0] } },
    transaction,
  });
  if (rows.length === 0) return [];
  const users = await User.findAll({
    where: { id: { [Op.in]: rows.map((r) => r.userId) }, active: true },
    transaction,
  });
  return users.map((u) => u.email);
}

export async function emailOf(userId: number, transaction?: Transaction): Promise<string[]> {
  const user = await User.findByPk(userId, { transaction });
  return user && user.active ? [user.email] : [];
}
