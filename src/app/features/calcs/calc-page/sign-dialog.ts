import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { SessionStore } from '../../../core/auth/session-store';
import { assertApiFailure, type ApiFailure } from '../../../core/http/api-failure';
import { LoadFailure } from '../../../ui/load-failure';
import { AccountApi } from '../../account/account-api';
import { failingRowText, signingReadiness } from './signing-readiness';
import { CalcsApi } from '../calcs-api';

export interface SignDialogData {
  revision: RevisionDto;
  meaning: 'authored' | 'checked' | 'approved';
  calcLabel: string;
}

const STATEMENTS: Record<SignDialogData['meaning'], string> = {
  authored: 'I prepared this revision, its inputs are as I intend them, and I submit it for independent check.',
  checked: 'I checked this revision independently, item by item, and found it correct against the standard shown.',
  approved: 'I reviewed this checked revision and approve it for release.',
};

/** Re-authentication for an e-signature: the signer's password, the meaning, and one idempotency key. */
@Component({
  selector: 'tt-sign-dialog',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    LoadFailure,
  ],
  templateUrl: './sign-dialog.html',
  styleUrl: './sign-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignDialog {
  private readonly api = inject(CalcsApi);
  private readonly ref = inject(MatDialogRef<SignDialog, RevisionDto>);
  protected readonly data = inject<SignDialogData>(MAT_DIALOG_DATA);
  protected readonly me = inject(SessionStore).user;
  protected readonly statement = STATEMENTS[this.data.meaning];
  // One key per dialog: a double click or a retried request still yields exactly one signature.
  private readonly idempotencyKey = crypto.randomUUID();
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', Validators.required],
    oneTimeCode: [''],
  });
  protected readonly secondFactor = inject(AccountApi).secondFactor();
  protected readonly codeSetting = computed(() =>
    this.secondFactor.hasValue() ? this.secondFactor.value() : undefined,
  );
  protected readonly problem = signal<string | null>(null);
  protected readonly isSigning = signal(false);
  protected readonly readiness = signingReadiness(this.data.revision, this.data.meaning, this.me());
  protected readonly failingRowText = failingRowText;

  protected async sign(): Promise<void> {
    if (this.readiness.blockers.length) return;
    if (this.form.invalid || this.isSigning()) return this.form.markAllAsTouched();
    this.isSigning.set(true);
    this.problem.set(null);
    try {
      const signed = await this.api.sign(this.data.revision.id, {
        password: this.form.getRawValue().password,
        meaning: this.data.meaning,
        ...(this.codeSetting()?.enrolled ? { oneTimeCode: this.form.getRawValue().oneTimeCode.trim() } : {}),
        idempotencyKey: this.idempotencyKey,
        lockVersion: this.data.revision.lockVersion,
      });
      this.ref.close(signed);
    } catch (error) {
      assertApiFailure(error);
      this.showFailure(error);
    } finally {
      this.isSigning.set(false);
    }
  }

  /**
   * One error, on the right thing: a wrong password or code marks that field; anything else is a message and the
   * password stays.
   */
  private showFailure(failure: ApiFailure): void {
    const fields = Object.keys(failure.fieldErrors) as ('password' | 'oneTimeCode')[];
    const own = fields.filter((f) => f === 'password' || f === 'oneTimeCode');
    if (!own.length) return this.problem.set(failure.message);
    for (const f of own) {
      this.form.controls[f].setValue('');
      this.form.controls[f].setErrors({ server: failure.fieldErrors[f].join('; ') });
      this.form.controls[f].markAsTouched();
    }
  }
}
