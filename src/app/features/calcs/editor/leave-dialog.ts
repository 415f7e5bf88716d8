import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatDialogModule } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';

/** Asked before leaving the editor with changes that are not saved as a revision yet. */
@Component({
  selector: 'tt-leave-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Leave without saving?</h2>
    <mat-dialog-content>
      <p>Your changes are not saved to the revision. A copy stays in this browser and is offered again when you come back,
        but nobody else sees it until you save.</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button [mat-dialog-close]="true">Leave</button>
      <button mat-flat-button [mat-dialog-close]="false" cdkFocusInitial>Stay and save</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LeaveDialog {}
