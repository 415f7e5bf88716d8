import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { SecondFactorEnrolment } from '../../../../shared/schemas/second-factor.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { AccountApi } from './account-api';

/** Sets up a time-based one-time code (authenticator app) that every signature then asks for. */
@Component({
  selector: 'tt-second-factor-panel',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, LoadFailure],
  template: `
    <h2 id="tf-title">One-time code for signatures</h2>
    @if (status.error(); as error) {
      <tt-load-failure [error]="error" what="one-time code settings" (retry)="status.reload()" />
    }
    @if (current(); as s) {
      @if (s.enrolled) {
        <p>Your signatures ask for a code from your authenticator app as well as your password.</p>
        @if (!s.required) {
          <mat-form-field
            ><mat-label>Password, to switch it off</mat-label
            ><input
              matInput
              type="password"
              [ngModel]="password()"
              (ngModelChange)="password.set($event)"
              autocomplete="current-password"
          /></mat-form-field>
          <button mat-stroked-button (click)="disable()" [disabled]="!password()">Switch off</button>
        } @else {
          <p class="tt-muted small">An administrator requires it for your signatures.</p>
        }
      } @else if (enrolment(); as e) {
        <p>Scan this with an authenticator app, then enter the code it shows.</p>
        <img [src]="e.qrDataUrl" width="180" height="180" alt="QR code holding your one-time-code set-up" />
        <p class="tt-muted small">
          Or type this key: <span class="tt-mono">{{ e.secret }}</span>
        </p>
        <mat-form-field
          ><mat-label>Code from the app</mat-label
          ><input
            matInput
            inputmode="numeric"
            maxlength="6"
            [ngModel]="code()"
            (ngModelChange)="code.set($event)"
            autocomplete="one-time-code"
        /></mat-form-field>
        <button mat-flat-button (click)="confirm()" [disabled]="code().length !== 6">Confirm</button>
      } @else {
        <p>
          {{
            s.required
              ? 'An administrator requires a one-time code for your signatures; set it up before you next sign.'
              : 'Optional: ask for a code from an authenticator app whenever you sign.'
          }}
        </p>
        <button mat-flat-button (click)="begin()">Set up</button>
      }
    }
    @if (problem(); as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
  `,
  styles:
    'h2 { margin: 0 0 12px; font: var(--mat-sys-title-medium); } .small { font-size: 12px; } .problem { color: var(--tt-fail); } :host { display: grid; gap: 8px; justify-items: start; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SecondFactorPanel {
  private readonly api = inject(AccountApi);
  protected readonly status = this.api.secondFactor();
  protected readonly current = computed(() => (this.status.hasValue() ? this.status.value() : undefined));
  protected readonly enrolment = signal<SecondFactorEnrolment | null>(null);
  protected readonly code = signal('');
  protected readonly password = signal('');
  protected readonly problem = signal<string | null>(null);

  protected begin(): Promise<void> {
    return this.run(async () => this.enrolment.set(await this.api.beginSecondFactor()));
  }

  protected confirm(): Promise<void> {
    return this.run(async () => {
      this.status.set(await this.api.confirmSecondFactor(this.code()));
      this.enrolment.set(null);
    });
  }

  protected disable(): Promise<void> {
    return this.run(async () => this.status.set(await this.api.disableSecondFactor(this.password())));
  }

  private async run(step: () => Promise<void>): Promise<void> {
    this.problem.set(null);
    try {
      await step();
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.lines()[0]);
    }
  }
}
