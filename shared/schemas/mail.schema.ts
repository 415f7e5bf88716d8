import { z } from 'zod';
import type { Role } from '../authz/roles';

/** Every kind of mail Torquetrail sends, and the role that normally receives it. */
export const MAIL_EVENTS = ['submitted', 'checked', 'returned', 'approved', 'impact'] as const;
export type MailEvent = (typeof MAIL_EVENTS)[number];

export const MAIL_EVENT_INFO: Record<MailEvent, { label: string; description: string; role: Role }> = {
  submitted: {
    label: 'Calc ready for check',
    description: 'An author submitted a calc for independent check.',
    role: 'checker',
  },
  checked: {
    label: 'Calc ready for approval',
    description: 'A checker signed a calc as checked and it waits for approval.',
    role: 'approver',
  },
  returned: {
    label: 'Your calc was returned',
    description: 'A checker or approver returned your calc with findings to answer.',
    role: 'author',
  },
  approved: { label: 'Your calc was approved', description: 'An approver released your calc.', role: 'author' },
  impact: {
    label: 'New standard changes approved calcs',
    description: 'A newly effective design standard changes the verdict of approved calcs.',
    role: 'compliance',
  },
};

export interface MailPreferenceDto {
  event: MailEvent;
  label: string;
  description: string;
  enabled: boolean;
  /** True when one of the person's roles receives this mail at all. */
  appliesToYou: boolean;
}

export const mailPreferencesSchema = z
  .object({
    preferences: z
      .partialRecord(
        z.enum(MAIL_EVENTS, { error: 'is not a mail event' }),
        z.boolean({ error: 'must be true or false' }),
      )
      .refine((r) => Object.keys(r).length > 0, 'name at least one event'),
  })
  .strict();
export type MailPreferencesRequest = z.infer<typeof mailPreferencesSchema>;

export const SENT_MAIL_STATUSES = ['pending', 'sent', 'failed'] as const;
/** Every kind of mail the outbox holds: the hand-overs and impact notices people choose, and role changes. */
export const OUTBOX_EVENTS = [...MAIL_EVENTS, 'role_change'] as const;

export const sentMailQuerySchema = z.object({
  page: z.coerce.number({ error: 'must be a number' }).int().min(0).default(0),
  size: z.coerce.number({ error: 'must be a number' }).int().min(1).max(200).default(25),
  status: z.enum(SENT_MAIL_STATUSES, { error: 'must be pending, sent or failed' }).optional(),
  event: z.enum(OUTBOX_EVENTS, { error: 'is not a kind of mail' }).optional(),
});
export type SentMailQuery = z.infer<typeof sentMailQuerySchema>;

export interface SentMailDto {
  id: number;
  event: string;
  recipient: string;
  subject: string;
  status: (typeof SENT_MAIL_STATUSES)[number];
  attempts: number;
  createdAt: string;
  sentAt: string | null;
  nextAttemptAt: string;
  lastError: string | null;
  messageId: string;
  body?: string;
}
