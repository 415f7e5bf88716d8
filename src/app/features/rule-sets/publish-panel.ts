import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { RuleSetDto } from '../../../../shared/schemas/rule-set.schema';
import { SessionStore } from '../../core/auth/session-store';
import { assertApiFailure } from '../../core/http/api-failure';
import { ruleSetProblems } from './rule-set-messages';
import { RuleSetsApi } from './rule-sets-api';

/** Two people make a version effective: one proposes it with a date, a second confirms with their password. */
@Component({
  selector: 'tt-publish-panel',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <ol class="steps">
      <li [class.done]="!!version().proposedBy">
        <h3>1. Propose with an effective date</h3>
        @if (version().proposedBy) {
          <p>
            Proposed by {{ version().proposedBy }} to take effect on {{ version().effectiveDate }}. Saving the draft
            again withdraws the proposal.
          </p>
        } @else {
          <mat-form-field
            ><mat-label>Effective from</mat-label
            ><input matInput type="date" [ngModel]="date()" (ngModelChange)="date.set($event)"
          /></mat-form-field>
          <button mat-flat-button (click)="propose()" [disabled]="!date()">Propose</button>
        }
      </li>
      <li>
        <h3>2. Confirm (a second compliance user)</h3>
        @if (version().confirmedBy) {
          <p>
            Confirmed by {{ version().confirmedBy }}; it comes into force on {{ version().effectiveDate }} and no longer
            changes.
          </p>
        } @else if (!version().proposedBy) {
          <p class="tt-muted">Waits for a proposal.</p>
        } @else if (isProposer()) {
          <p class="tt-muted">You proposed this version, so someone else in compliance must confirm it.</p>
        } @else {
          <p>
            Confirming makes v{{ version().version }} effective and retires the version in force. Approved calcs it
            affects are reported to compliance by e-mail.
          </p>
          <mat-form-field
            ><mat-label>Your password</mat-label
            ><input
              matInput
              type="password"
              autocomplete="current-password"
              [ngModel]="password()"
              (ngModelChange)="password.set($event)"
          /></mat-form-field>
          <button mat-flat-button (click)="confirm()" [disabled]="!password()">Confirm and make effective</button>
        }
      </li>
    </ol>
    @if (problem(); as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
  `,
  styles: `
    .steps {
      list-style: none;
      padding: 0;
      margin: 0;
      display: grid;
      gap: 14px;
    }
    li {
      border: 1px solid var(--tt-rule);
      border-radius: 4px;
      padding: 10px 14px;
      display: grid;
      gap: 6px;
      justify-items: start;
    }
    li.done {
      border-left: 4px solid var(--tt-pass);
    }
    h3 {
      margin: 0;
      font: var(--mat-sys-title-small);
    }
    p {
      margin: 0;
    }
    .problem {
      color: var(--tt-fail);
      font-weight: 500;
      margin-top: 10px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PublishPanel {
  private readonly api = inject(RuleSetsApi);
  private readonly me = inject(SessionStore).user;
  readonly version = input.required<RuleSetDto>();
  readonly changed = output<void>();
  protected readonly date = signal('');
  protected readonly password = signal('');
  protected readonly problem = signal<string | null>(null);
  protected readonly isProposer = computed(() => this.version().proposedBy === this.me()?.displayName);

  protected propose(): Promise<void> {
    return this.run(() => this.api.propose(this.version().id, this.date(), this.version().lockVersion));
  }

  protected confirm(): Promise<void> {
    return this.run(() => this.api.confirm(this.version().id, this.password(), this.version().lockVersion));
  }

  private async run(call: () => Promise<unknown>): Promise<void> {
    this.problem.set(null);
    try {
      await call();
      this.password.set('');
      this.changed.emit();
    } catch (error) {
      assertApiFailure(error);
      // A proposal re-validates the whole document: name each field as the standard's page does.
      this.problem.set(
        ruleSetProblems(error, null)
          .map((p) => p.text)
          .join('; '),
      );
    }
  }
}
