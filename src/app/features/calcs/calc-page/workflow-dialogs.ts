import { Injectable, inject } from '@angular/core';
import { Router } from '@angular/router';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { assertApiFailure } from '../../../core/http/api-failure';
import { CalcsApi } from '../calcs-api';
import { SignDialog, type SignDialogData } from './sign-dialog';
import { ReasonDialog, type ReasonDialogResult } from './reason-dialog';
import { reasonDialogTexts, type ReasonKind } from './reason-texts';

/** The calc page's steps that go through a dialog: signing, and returning, withdrawing or starting a revision. */
@Injectable()
export class WorkflowDialogs {
  private readonly api = inject(CalcsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  /** Opens the sign dialog; a signed revision goes to `updated`, then a note says the state it reached. */
  sign(
    revision: RevisionDto,
    meaning: SignDialogData['meaning'],
    calcLabel: string,
    updated: (r: RevisionDto) => void,
  ): void {
    this.dialog
      .open(SignDialog, { data: { revision, meaning, calcLabel } satisfies SignDialogData, width: '600px' })
      .afterClosed()
      .subscribe((signed?: RevisionDto) => {
        if (!signed) return;
        updated(signed);
        this.snackBar.open(`Signed as ${meaning}. The revision is now ${signed.status.replace('_', ' ')}.`, 'OK', {
          duration: 6000,
        });
      });
  }

  /** Asks for the reason, then applies the step to the revision shown when the dialog closes. */
  askReason(kind: ReasonKind, current: () => RevisionDto | undefined, updated: (r: RevisionDto) => void): void {
    const open = (current()?.findings ?? []).filter((f) => f.status === 'open').map((f) => `F${f.id}`);
    this.dialog
      .open(ReasonDialog, { data: reasonDialogTexts(kind, open) })
      .afterClosed()
      .subscribe((answer?: ReasonDialogResult) => {
        if (answer) void this.applyReason(kind, current()!, answer, updated);
      });
  }

  private async applyReason(
    kind: ReasonKind,
    r: RevisionDto,
    { reason, choice: carryAttachments }: ReasonDialogResult,
    updated: (r: RevisionDto) => void,
  ): Promise<void> {
    try {
      if (kind === 'new-revision') {
        const created = await this.api.newRevision(r.calcId, reason, carryAttachments);
        await this.router.navigate(['/revisions', created.id, 'edit']);
        return;
      }
      updated(
        kind === 'return'
          ? await this.api.returnToAuthor(r.id, reason, r.lockVersion)
          : await this.api.withdraw(r.id, reason, r.lockVersion),
      );
    } catch (error) {
      assertApiFailure(error);
      this.snackBar.open(error.message, 'OK', { duration: 8000 });
    }
  }
}
