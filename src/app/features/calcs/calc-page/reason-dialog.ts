import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

export interface ReasonDialogData {
  title: string;
  label: string;
  hint: string;
  action: string;
  /** When set, an explicit yes/no choice shown under the reason (e.g. carry attachments over). */
  choice?: { label: string; hint: string };
}
export interface ReasonDialogResult {
  reason: string;
  choice: boolean;
}

/** Asks for the reason behind a return, a withdrawal or a new revision; the reason goes on record. */
@Component({
  selector: 'tt-reason-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
  ],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      <form [formGroup]="form" id="reason-form" (ngSubmit)="submit()" novalidate>
        <mat-form-field class="full">
          <mat-label>{{ data.label }}</mat-label>
          <textarea matInput formControlName="reason" rows="4" required></textarea>
          <mat-hint>{{ data.hint }}</mat-hint>
          @if (form.controls.reason.invalid) {
            <mat-error>Say why, in at least 5 characters</mat-error>
          }
        </mat-form-field>
        @if (data.choice; as choice) {
          <mat-checkbox formControlName="choice">{{ choice.label }}</mat-checkbox>
          <p class="choice-hint">{{ choice.hint }}</p>
        }
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button mat-dialog-close type="button">Cancel</button>
      <button mat-flat-button type="submit" form="reason-form">{{ data.action }}</button>
    </mat-dialog-actions>
  `,
  styles:
    '.full { width: min(520px, 80vw); margin-top: 8px; } .choice-hint { font-size: 12px; margin: 0 0 0 40px; color: var(--tt-ink-soft, #5b5b5b); }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReasonDialog {
  protected readonly data = inject<ReasonDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject(MatDialogRef<ReasonDialog, ReasonDialogResult>);
  protected readonly form = inject(NonNullableFormBuilder).group({
    reason: ['', [Validators.required, Validators.minLength(5), Validators.maxLength(4000)]],
    choice: [false],
  });

  protected submit(): void {
    if (this.form.invalid) return this.form.markAllAsTouched();
    const { reason, choice } = this.form.getRawValue();
    this.ref.close({ reason: reason.trim(), choice });
  }
}
