import type { AppAbility } from '../../shared/authz/app-ability';
import type { Page } from '../../shared/schemas/common.schema';
import type { SentMailDto, SentMailQuery } from '../../shared/schemas/mail.schema';
import { MailOutbox } from '../db/models';
import { AppError } from '../errors/app-error';
import { messageIdOf } from './message-id';
import { forbiddenCheck } from '../authz/forbidden-check';

function toDto(row: MailOutbox, from: string, withBody: boolean): SentMailDto {
  return {
    id: Number(row.id),
    event: row.event,
    recipient: row.recipient,
    subject: row.subject,
    status: row.status,
    attempts: row.attempts,
    createdAt: row.createdAt.toISOString(),
    sentAt: row.sentAt ? row.sentAt.toISOString() : null,
    nextAttemptAt: row.nextAttemptAt.toISOString(),
    lastError: row.lastError,
    messageId: messageIdOf(row, from),
    ...(withBody ? { body: row.body } : {}),
  };
}

/** The admin's read-only view of the mail outbox: what was sent, to whom, and what is still trying. */
export class SentMailService {
  constructor(
    private readonly from: string,
    private readonly isEnabled: boolean,
  ) {}

  async list(ability: AppAbility, query: SentMailQuery): Promise<Page<SentMailDto>> {
    this.assertAllowed(ability);
    const { rows, count } = await MailOutbox.findAndCountAll({
      where: { ...(query.status ? { status: query.status } : {}), ...(query.event ? { event: query.event } : {}) },
      order: [['id', 'DESC']],
      offset: query.page * query.size,
      limit: query.size,
    });
    return { items: rows.map((r) => toDto(r, this.from, false)), total: count, page: query.page, size: query.size };
  }

  async get(ability: AppAbility, id: number): Promise<SentMailDto> {
    this.assertAllowed(ability);
    const row = await MailOutbox.findByPk(id);
    if (!row) throw AppError.notFound(`Mail ${id}`);
    return toDto(row, this.from, true);
  }

  private assertAllowed(ability: AppAbility): void {
    forbiddenCheck(ability).setMessage('The sent-mail screen is for administrators').throwUnlessCan('read', 'SentMail');
    if (!this.isEnabled)
      throw new AppError(
        'not_found',
        404,
        'The sent-mail screen is turned off on this server (SENT_MAIL_SCREEN=false)',
      );
  }
}
