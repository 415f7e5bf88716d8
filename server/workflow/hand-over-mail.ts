import type { Transaction } from 'sequelize';
import { CAUTION } from '../../shared/engine';
import { enqueueMail, emailOf, emailsOfRole } from '../mail/outbox';

export interface HandOverFacts {
  event: 'submitted' | 'checked' | 'returned' | 'approved';
  calcId: number;
  calcNumber: string;
  calcTitle: string;
  projectCode: string;
  revision: string;
  actorName: string;
  authorId: number;
  checkerId: number | null;
  editorIds: number[];
  reason?: string;
  baseUrl: string;
}

/** Who hears of each hand-over, and what they are told. */
export async function queueHandOverMail(f: HandOverFacts, transaction: Transaction): Promise<void> {
  const what = `${f.projectCode} ${f.calcNumber} rev ${f.revision} — ${f.calcTitle}`;
  const link = `${f.baseUrl}/calcs/${f.calcId}`;
  const lines = (headline: string, next: string) =>
    [
      headline,
      '',
      `Calc: ${what}`,
      `By: ${f.actorName}`,
      ...(f.reason ? [`Reason: ${f.reason}`] : []),
      '',
      next,
      link,
      '',
      CAUTION,
    ].join('\n');
  switch (f.event) {
    case 'submitted':
      return enqueueMail(
        await emailsOfRole('checker', f.editorIds, transaction),
        {
          event: f.event,
          subject: `Ready for check: ${what}`,
          body: lines(`${f.actorName} submitted a calc for independent check.`, 'Open it to check:'),
        },
        transaction,
      );
    case 'checked':
      // The checker may hold the approver role too, but never approves what they checked.
      return enqueueMail(
        await emailsOfRole('approver', [...f.editorIds, ...(f.checkerId ? [f.checkerId] : [])], transaction),
        {
          event: f.event,
          subject: `Ready for approval: ${what}`,
          body: lines(`${f.actorName} signed a calc as checked.`, 'Open it to review and approve:'),
        },
        transaction,
      );
    case 'returned':
      return enqueueMail(
        await emailOf(f.authorId, transaction),
        {
          event: f.event,
          subject: `Returned with findings: ${what}`,
          body: lines(`${f.actorName} returned your calc with findings.`, 'Answer the findings and resubmit:'),
        },
        transaction,
      );
    case 'approved':
      return enqueueMail(
        await emailOf(f.authorId, transaction),
        {
          event: f.event,
          subject: `Approved: ${what}`,
          body: lines(`${f.actorName} approved your calc.`, 'The approved record:'),
        },
        transaction,
      );
  }
}
