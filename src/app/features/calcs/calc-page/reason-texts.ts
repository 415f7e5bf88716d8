import type { ReasonDialogData } from './reason-dialog';

/** What a reason is asked for on the calc page. */
export type ReasonKind = 'return' | 'withdraw' | 'new-revision';

/**
 * The reason dialog's words for each kind. A return's reason becomes a finding only when none is open; otherwise
 * the open findings (`openFindings`, as F12) go back and the reason rides with the return.
 */
export function reasonDialogTexts(kind: ReasonKind, openFindings: readonly string[]): ReasonDialogData {
  switch (kind) {
    case 'return':
      return {
        title: 'Return to the author',
        label: 'What must change',
        hint: openFindings.length
          ? `Open ${openFindings.join(', ')} go back for answers; ` +
            'this reason is kept with the return, not added as another finding.'
          : 'This becomes a finding the author must answer.',
        action: 'Return',
      };
    case 'withdraw':
      return {
        title: 'Withdraw this revision',
        label: 'Reason for withdrawal',
        hint: 'Kept on the record.',
        action: 'Withdraw',
      };
    case 'new-revision':
      return {
        title: 'Start a new revision',
        label: 'Reason for change',
        hint: 'Printed on the report and kept on the record.',
        action: 'Start revision',
        choice: {
          label: 'Carry over this revision’s attachments',
          hint:
            'Copies the files into the new revision; its signatures will cover them. ' +
            'The audit trail lists what was carried over.',
        },
      };
  }
}
