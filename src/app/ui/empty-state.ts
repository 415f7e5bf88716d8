import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** An honest empty state: what is missing, and what makes it appear. */
@Component({
  selector: 'tt-empty-state',
  imports: [MatIconModule],
  template: `
    <div class="empty" role="status">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <div>
        <p class="title">{{ title() }}</p>
        <p class="hint"><ng-content /></p>
      </div>
    </div>
  `,
  styles: `
    /* In a table wider than a phone's screen the empty row spans the whole table: the message stays in view at
       the left edge of the scrolling box and wraps within the screen's width, not the table's. */
    :host {
      display: block;
      position: sticky;
      left: 0;
      max-width: min(100%, calc(100vw - 48px));
    }
    .empty {
      display: flex;
      gap: 14px;
      align-items: flex-start;
      padding: 18px 20px;
      color: var(--tt-ink-soft);
    }
    mat-icon {
      font-size: 28px;
      width: 28px;
      height: 28px;
      color: #8aa3a6;
    }
    .title {
      margin: 0 0 4px;
      font-weight: 500;
      color: var(--tt-ink);
    }
    .hint {
      margin: 0;
      font-size: 13px;
      line-height: 1.5;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmptyState {
  readonly icon = input('inbox');
  readonly title = input.required<string>();
}
