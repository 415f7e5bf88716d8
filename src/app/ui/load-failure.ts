import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ApiFailure } from '../core/http/api-failure';

/**
 * Says why a read failed, in place of the data it should have shown: not found, not allowed,
 * not reachable or a server failure are different situations with different next steps.
 */
export function loadFailureText(error: unknown, what: string): string {
  if (!(error instanceof ApiFailure)) return `The ${what} arrived in a form this page cannot read; reload the page.`;
  switch (error.status) {
    case 0:
      return `The ${what} could not be loaded: ${error.message}.`;
    case 404:
      return `The ${what} was not found. It may have been removed, or the address is wrong.`;
    case 403:
      return `You do not have permission to see the ${what}.`;
    case 400:
      return `The ${what} could not be loaded: ${error.message}.`;
    default:
      return error.status >= 500
        ? `The server failed to load the ${what}; try again in a moment. (${error.message})`
        : `The ${what} could not be loaded: ${error.message}.`;
  }
}

const FAILURE_ICONS: Record<number, string> = { 404: 'search_off', 403: 'lock' };

/** The inline message for a failed read, with a retry where retrying can help. */
@Component({
  selector: 'tt-load-failure',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="failure" role="alert">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <p>{{ text() }}</p>
      @if (canRetry()) {
        <button mat-button type="button" (click)="retry.emit()">Try again</button>
      }
    </div>
  `,
  styles: `
    .failure {
      display: flex;
      gap: 12px;
      align-items: center;
      padding: 14px 18px;
      color: var(--tt-fail);
    }
    p {
      margin: 0;
      flex: 1;
      line-height: 1.5;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadFailure {
  /** The resource's `error()`. */
  readonly error = input.required<unknown>();
  /** What the read was for, as the screen names it: "project", "list of projects". */
  readonly what = input.required<string>();
  readonly retry = output();

  protected readonly text = computed(() => loadFailureText(this.error(), this.what()));
  private readonly status = computed(() =>
    this.error() instanceof ApiFailure ? (this.error() as ApiFailure).status : -1,
  );
  protected readonly icon = computed(() => FAILURE_ICONS[this.status()] ?? 'error_outline');
  protected readonly canRetry = computed(() => this.status() === 0 || this.status() >= 500);
}
