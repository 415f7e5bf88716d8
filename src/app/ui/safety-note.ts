import { ChangeDetectionStrategy, Component, booleanAttribute, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CAUTION } from '../../../shared/engine/version';

/** The caution every place with results carries: the product supports engineers, it does not replace them. */
@Component({
  selector: 'tt-safety-note',
  imports: [MatIconModule],
  template: `
    <aside class="note" [class.compact]="compact()" aria-label="Engineering caution">
      <mat-icon aria-hidden="true">engineering</mat-icon>
      <p>{{ caution }}</p>
    </aside>
  `,
  styles: `
    .note {
      display: flex;
      gap: 10px;
      align-items: flex-start;
      padding: 10px 14px;
      border-radius: 4px;
      background: #fbf1e4;
      border-left: 4px solid var(--tt-copper);
      color: #4a3620;
    }
    .note p {
      margin: 0;
      font-size: 13px;
      line-height: 1.45;
    }
    .note mat-icon {
      color: var(--tt-copper);
      flex: none;
    }
    .compact p {
      font-size: 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SafetyNote {
  readonly compact = input(false, { transform: booleanAttribute });
  protected readonly caution = CAUTION;
}
