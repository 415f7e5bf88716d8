import net from 'node:net';
import { Op, type Sequelize } from 'sequelize';
import { MailOutbox, User } from '../../server/db/models';
import { MailSender } from '../../server/mail/mail-sender';
import { createMailTransport } from '../../server/mail/transport';

export const FROM = 'Torquetrail <torquetrail@kestrelfen.example>';

/** A sender like the one in server/main.ts, pointed at `port`, with a clock the test controls. */
export function senderFor(
  sequelize: Sequelize,
  port: number,
  options: { clock?: () => Date; maxAttempts?: number } = {},
) {
  const transport = createMailTransport({
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: port,
    SMTP_SECURE: false,
    SMTP_USER: 'tt',
    SMTP_PASSWORD: 'any',
  });
  const sender = new MailSender(sequelize, {
    transport,
    from: FROM,
    maxAttempts: options.maxAttempts ?? 5,
    backoffSeconds: 30,
    clock: options.clock,
  });
  return { sender, close: () => transport.close() };
}

/** A loopback port nobody listens on: an SMTP server that is down. */
export async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

export async function emailsOf(...userIds: number[]): Promise<string[]> {
  const users = await User.findAll({ where: { id: { [Op.in]: userIds } } });
  return userIds.map((id) => users.find((u) => u.id === id)!.email);
}

/** Outbox rows addressed to these people, oldest first. */
export function outboxFor(addresses: string[]) {
  return MailOutbox.findAll({ where: { recipient: { [Op.in]: addresses } }, order: [['id', 'ASC']] });
}

/** Hand-over mails about one project (its code is unique and is in every subject). */
export async function mailAbout(projectCode: string, event?: string) {
  const rows = await MailOutbox.findAll({
    where: { subject: { [Op.like]: `%${projectCode}%` }, ...(event ? { event } : {}) },
    order: [['id', 'ASC']],
  });
  return rows.map((r) => ({
    event: r.event,
    recipient: r.recipient,
    subject: r.subject,
    body: r.body,
    status: r.status,
  }));
}
