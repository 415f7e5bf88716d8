import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatDialogModule } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';

/** What the author chose: leave and drop the edits, stay on the page, or save the revision and then leave. */
export type LeaveChoice = 'leave' | 'stay' | 'save';

/** Asked before leaving the editor with changes that are not saved as a revision yet. */
@Component({
  selector: 'tt-leave-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Leave without saving?</h2>
    <mat-dialog-content>
      <p>
        Your changes are not saved to the revision. A copy stays in this browser and is offered again when you come
        back, but nobody else sees it until you save.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button mat-dialog-close="leave">Leave without saving</button>
      <button mat-stroked-button mat-dialog-close="stay">Stay here</button>
      <button mat-flat-button mat-dialog-close="save" cdkFocusInitial>Save and leave</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LeaveDialog {}
