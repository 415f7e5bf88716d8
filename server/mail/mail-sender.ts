import { QueryTypes, Op, type Sequelize, type Transaction } from 'sequelize';
import type { Transporter } from 'nodemailer';
import { MailOutbox } from '../db/models';
import { logger } from '../logger';
import { messageIdOf } from './message-id';

export interface SenderOptions {
  transport: Transporter;
  from: string;
  maxAttempts: number;
  backoffSeconds: number;
  /** Injected so tests can step time forward instead of waiting for it. */
  clock?: () => Date;
}

export interface SendRound {
  sent: number;
  retrying: number;
  failed: number;
}

// Retries double from the base delay but never wait longer than this between attempts.
const MAX_DELAY_SECONDS = 6 * 3600;

/**
 * Delivers the mail outbox. Each row is claimed with `FOR UPDATE SKIP LOCKED` inside its own
 * transaction, sent, and marked in that same transaction: several app instances never send one
 * row twice, and a crash before the commit leaves the row pending (delivered at least once; the
 * stable Message-ID makes a rare repeat recognisable). Errors are logged, never thrown onward.
 */
export class MailSender {
  private timer: NodeJS.Timeout | undefined;
  private running: Promise<unknown> | undefined;
  private stopping = false;
  private readonly clock: () => Date;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly options: SenderOptions,
  ) {
    this.clock = options.clock ?? (() => new Date());
  }

  /** Sends every row due now (optionally only the given ids) and reports what happened. */
  async runOnce(filter: { ids?: number[] } = {}): Promise<SendRound> {
    const round: SendRound = { sent: 0, retrying: 0, failed: 0 };
    // After stop() the round ends at the row in hand, so a shutdown need not wait for a long queue.
    for (let i = 0; i < 1000 && !this.stopping; i++) {
      const outcome = await this.sequelize.transaction((t) => this.sendNext(t, filter));
      if (!outcome) break;
      round[outcome]++;
    }
    return round;
  }

  start(pollSeconds: number): void {
    this.stopping = false;
    const tick = () => {
      this.running = this.runOnce()
        .catch((err) => logger.error({ err }, 'mail sender round failed; will retry'))
        .finally(() => {
          if (this.timer) this.timer = setTimeout(tick, pollSeconds * 1000);
        });
    };
    this.timer = setTimeout(tick, 0);
  }

  async stop(): Promise<void> {
    this.stopping = true;
    clearTimeout(this.timer);
    this.timer = undefined;
    await this.running;
  }

  private async sendNext(transaction: Transaction, filter: { ids?: number[] }): Promise<keyof SendRound | null> {
    const now = this.clock();
    const onlyIds = filter.ids ? ` AND id IN (${filter.ids.map(Number).join(',') || '0'})` : '';
    const [claimed] = await this.sequelize.query<{ id: number }>(
      `SELECT id FROM mail_outbox WHERE status = 'pending' AND next_attempt_at <= ?${onlyIds} ORDER BY id LIMIT 1 FOR UPDATE SKIP LOCKED`,
      { replacements: [now], type: QueryTypes.SELECT, transaction },
    );
    if (!claimed) return null;
    const row = (await MailOutbox.findOne({ where: { id: { [Op.eq]: claimed.id } }, transaction }))!;
    try {
      await this.options.transport.sendMail({
        from: this.options.from,
        to: row.recipient,
        subject: row.subject,
        text: row.body,
        messageId: messageIdOf(row, this.options.from),
        headers: { 'X-Torquetrail-Event': row.event },
      });
      await row.update({ status: 'sent', sentAt: now, attempts: row.attempts + 1, lastError: null }, { transaction });
      return 'sent';
    } catch (err) {
      return this.recordFailure(row, err, now, transaction);
    }
  }

  private async recordFailure(
    row: MailOutbox,
    err: unknown,
    now: Date,
    transaction: Transaction,
  ): Promise<'retrying' | 'failed'> {
    const attempts = row.attempts + 1;
    const lastError = (err instanceof Error ? err.message : String(err)).slice(0, 2000);
    const isFinal = attempts >= this.options.maxAttempts;
    const delay = Math.min(this.options.backoffSeconds * 2 ** (attempts - 1), MAX_DELAY_SECONDS);
    await row.update(
      {
        attempts,
        lastError,
        status: isFinal ? 'failed' : 'pending',
        nextAttemptAt: new Date(now.getTime() + delay * 1000),
      },
      { transaction },
    );
    const entry = { outboxId: row.id, recipient: row.recipient, attempts, error: lastError };
    if (isFinal) logger.error(entry, 'mail could not be delivered; giving up');
    else logger.warn({ ...entry, retryInSeconds: delay }, 'mail delivery failed; will retry');
    return isFinal ? 'failed' : 'retrying';
  }
}
