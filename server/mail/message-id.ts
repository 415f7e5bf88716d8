/**
 * Stable per outbox row, so a message delivered twice after a crash is recognisably the same one. Kept apart from the
 * SMTP transport: the sent-mail screen shows it without loading the SMTP client.
 */
export function messageIdOf(row: { id: number; createdAt: Date }, from: string): string {
  const domain = /@([^>\s]+)/.exec(from)?.[1] ?? 'torquetrail.invalid';
  return `<tt-outbox-${row.id}-${row.createdAt.getTime()}@${domain}>`;
}
