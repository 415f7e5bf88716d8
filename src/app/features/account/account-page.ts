import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { ROLE_LABELS } from '../../../../shared/authz/roles';
import { changePasswordSchema } from '../../../../shared/schemas/auth.schema';
import { SessionStore } from '../../core/auth/session-store';
import { assertApiFailure } from '../../core/http/api-failure';
import { schemaValidator } from '../../core/forms/schema-validator';
import { applyServerErrors } from '../../ui/field-errors';
import { SecondFactorPanel } from './second-factor-panel';
import { MailPreferences } from './mail-preferences';
import { SessionsPanel } from './sessions-panel';
import { AccountApi } from './account-api';

@Component({
  selector: 'tt-account-page',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MailPreferences,
    SecondFactorPanel,
    SessionsPanel,
  ],
  templateUrl: './account-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AccountPage {
  private readonly api = inject(AccountApi);
  protected readonly user = inject(SessionStore).user;
  protected readonly roles = computed(() => (this.user()?.roles ?? []).map((r) => ROLE_LABELS[r]).join(', '));
  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', Validators.required],
    newPassword: ['', [Validators.required, schemaValidator(changePasswordSchema.shape.newPassword, 'New password')]],
    repeatPassword: ['', Validators.required],
  });
  protected readonly problems = signal<string[]>([]);
  protected readonly isDone = signal(false);
  protected readonly isSaving = signal(false);
  private readonly sessionsPanel = viewChild.required(SessionsPanel);

  protected async changePassword(): Promise<void> {
    const { currentPassword, newPassword, repeatPassword } = this.form.getRawValue();
    if (newPassword !== repeatPassword) this.form.controls.repeatPassword.setErrors({ mismatch: true });
    if (this.form.invalid) return this.form.markAllAsTouched();
    this.isSaving.set(true);
    this.problems.set([]);
    try {
      await this.api.changePassword(currentPassword, newPassword);
      this.isDone.set(true);
      this.form.reset();
      this.sessionsPanel().reload();
    } catch (error) {
      assertApiFailure(error);
      this.problems.set(applyServerErrors(this.form, error));
    } finally {
      this.isSaving.set(false);
    }
  }
}
