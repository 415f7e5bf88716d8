import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import type { ActiveSessionDto } from '../../../../shared/schemas/session-list.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { SessionsApi } from './sessions-api';
import { browserLabel } from './browser-label';

/** Where you are signed in; end any session you do not recognise. A password change ends all but this one. */
@Component({
  selector: 'tt-sessions-panel',
  imports: [DatePipe, MatButtonModule, LoadFailure],
  template: `
    <h2 id="sessions-title">Where you are signed in</h2>
    <p class="tt-muted small">
      End a session you do not recognise, then change your password: that ends every session but this one.
    </p>
    @if (problem(); as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
    @if (sessions.error(); as error) {
      <tt-load-failure [error]="error" what="list of your sessions" (retry)="sessions.reload()" />
    }
    <ul class="sessions" aria-labelledby="sessions-title">
      @for (s of rows(); track s.id) {
        <li [class.current]="s.current">
          <div class="what">
            <strong [attr.title]="s.userAgent">{{ label(s) }}</strong>
            @if (s.current) {
              <span class="here">this session</span>
            }
          </div>
          <div class="tt-muted small">
            From {{ s.ip || 'an unknown address' }} · started {{ s.startedAt | date: 'd MMM y, HH:mm' }} · last used
            {{ s.lastSeenAt | date: 'd MMM y, HH:mm' }}
          </div>
          @if (!s.current) {
            <button
              mat-stroked-button
              type="button"
              [disabled]="ending() === s.id"
              (click)="end(s)"
              [attr.aria-label]="'End the session of ' + label(s) + ' from ' + (s.ip || 'an unknown address')"
            >
              End session
            </button>
          }
        </li>
      }
    </ul>
  `,
  styles: `
    h2 {
      margin: 0 0 6px;
      font: var(--mat-sys-title-medium);
    }
    .small {
      font-size: 12px;
    }
    .sessions {
      list-style: none;
      padding: 0;
      margin: 8px 0 0;
      display: grid;
      gap: 12px;
    }
    li {
      display: grid;
      gap: 4px;
      justify-items: start;
    }
    .what {
      display: flex;
      gap: 8px;
      align-items: baseline;
      overflow-wrap: anywhere;
    }
    .here {
      flex: none;
      white-space: nowrap;
      font-size: 12px;
      padding: 0 6px;
      border-radius: 8px;
      background: var(--mat-sys-secondary-container);
    }
    .problem {
      color: var(--tt-fail);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SessionsPanel {
  private readonly api = inject(SessionsApi);
  protected readonly sessions = this.api.sessions();
  protected readonly rows = computed(() => (this.sessions.hasValue() ? this.sessions.value() : []));
  protected readonly ending = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected label(s: ActiveSessionDto): string {
    return browserLabel(s.userAgent);
  }

  /** Called after a password change, which ends the other sessions on the server. */
  reload(): void {
    this.sessions.reload();
  }

  protected async end(session: ActiveSessionDto): Promise<void> {
    this.ending.set(session.id);
    this.problem.set(null);
    try {
      await this.api.end(session.id);
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.message);
    } finally {
      this.ending.set(null);
      this.sessions.reload();
    }
  }
}
