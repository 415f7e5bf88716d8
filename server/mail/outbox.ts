import { QueryTypes, type Transaction } from 'sequelize';
import type { Role } from '../../shared/authz/roles';
import { MailOutbox, User } from '../db/models';
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
  const subject = fitSubject(mail.subject);
  // One statement, whatever the number of people: a hand-over to every checker or approver of a large office is a row
  // each, and Sequelize's bulkCreate built a model instance per row and wrote its two times as text per row.
  await MailOutbox.sequelize!.query(
    `INSERT INTO mail_outbox (event, recipient, subject, body, status, attempts, next_attempt_at, created_at)
     SELECT :event, r.recipient, :subject, :body, 'pending', 0, :now, :now
     FROM JSON_TABLE(:recipients, '$[*]' COLUMNS (n FOR ORDINALITY, recipient VARCHAR(190) PATH '$')) r ORDER BY r.n`,
    {
      replacements: { ...mail, subject, now: new Date(), recipients: JSON.stringify(unique) },
      type: QueryTypes.INSERT,
      transaction,
    },
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

/** Active people holding a role, except those listed (e.g. the calc's own editors), in the order of their ids. */
export async function emailsOfRole(role: Role, excludeIds: number[], transaction?: Transaction): Promise<string[]> {
  const rows = await User.sequelize!.query<{ email: string }>(
    `SELECT u.email FROM user_roles r JOIN users u ON u.id = r.user_id
     WHERE r.role = :role AND u.active AND u.id NOT IN (:excluded) ORDER BY u.id`,
    { replacements: { role, excluded: excludeIds.length ? excludeIds : [0] }, type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => r.email);
}

export async function emailOf(userId: number, transaction?: Transaction): Promise<string[]> {
  const user = await User.findByPk(userId, { transaction });
  return user && user.active ? [user.email] : [];
}
