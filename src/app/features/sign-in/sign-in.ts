import { ChangeDetectionStrategy, Component, inject, input, signal, viewChild } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../../core/auth/session-store';
import { assertApiFailure } from '../../core/http/api-failure';
import { LogoMark } from '../../ui/logo-mark';
import { SafetyNote } from '../../ui/safety-note';

interface SignInForm {
  username: FormControl<string>;
  password: FormControl<string>;
}

@Component({
  selector: 'tt-sign-in',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatIconModule,
    MatProgressBarModule,
    LogoMark,
    SafetyNote,
  ],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SignIn {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  readonly returnTo = input<string>();
  readonly reason = input<string>();

  protected readonly form = new FormGroup<SignInForm>({
    username: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(64)] }),
    password: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(256)] }),
  });
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly isBusy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly showPassword = signal(false);

  protected async signIn(): Promise<void> {
    if (this.form.invalid || this.isBusy()) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.failure.set(null);
    try {
      await this.session.signIn(this.form.getRawValue());
      const target = this.returnTo();
      await this.router.navigateByUrl(target && target.startsWith('/') && !target.startsWith('//') ? target : '/');
    } catch (error) {
      assertApiFailure(error);
      this.failure.set(error.message);
      // One error, the server's: resetForm also forgets "submitted", so the emptied password is not reddened as missing
      // too.
      this.formDirective().resetForm({ username: this.form.controls.username.value, password: '' });
    } finally {
      this.isBusy.set(false);
    }
  }

  protected togglePassword(): void {
    this.showPassword.update((v) => !v);
  }
}
