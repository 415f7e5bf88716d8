import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import { ROLE_LABELS } from '../../../../shared/authz/roles';
import { SessionStore } from '../../core/auth/session-store';
import { toHttpFailure } from '../../core/errors/http-failure';
import { applyServerErrors } from '../../ui/field-errors';
import { SecondFactorPanel } from './second-factor-panel';
import { MailPreferences } from './mail-preferences';
import { SessionsPanel } from './sessions-panel';

@Component({
  selector: 'tt-account-page',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MailPreferences, SecondFactorPanel, SessionsPanel],
  templateUrl: './account-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AccountPage {
  private readonly http = inject(HttpClient);
  protected readonly user = inject(SessionStore).user;
  protected readonly roles = computed(() => (this.user()?.roles ?? []).map((r) => ROLE_LABELS[r]).join(', '));
  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', Validators.required],
    newPassword: ['', [Validators.required, Validators.minLength(12), Validators.maxLength(256)]],
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
      await firstValueFrom(this.http.post('/api/auth/password', { currentPassword, newPassword }));
      this.isDone.set(true);
      this.form.reset();
      this.sessionsPanel().reload();
    } catch (error) {
      this.problems.set(applyServerErrors(this.form, toHttpFailure(error)));
    } finally {
      this.isSaving.set(false);
    }
  }
}
