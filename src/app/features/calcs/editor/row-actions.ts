import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** How the two move buttons say where a row goes: a list reads up and down, the shaft's segments left to right. */
export type MoveWords = 'up-down' | 'left-right';
const WORDS: Record<MoveWords, readonly [string, string]> = {
  'up-down': ['up', 'down'],
  'left-right': ['left', 'right'],
};

/**
 * The buttons at the end of an editable row: remove, and for ordered lists move back and forth. The host
 * takes no box of its own, so the buttons sit in the caller's `.actions` cell or span as if written there.
 */
@Component({
  selector: 'tt-row-actions',
  imports: [MatButtonModule, MatIconModule],
  template: `
    @for (m of moveButtons(); track m.step) {
      <button
        mat-icon-button
        type="button"
        [disabled]="m.isDisabled"
        (click)="moved.emit(m.step)"
        [attr.aria-label]="m.label"
      >
        <mat-icon>{{ m.icon }}</mat-icon>
      </button>
    }
    <button mat-icon-button type="button" (click)="removed.emit()" [attr.aria-label]="'Remove ' + name()">
      <mat-icon>delete_outline</mat-icon>
    </button>
  `,
  styles: ':host { display: contents; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RowActions {
  /** How the buttons name the row to a screen reader: "segment 2", "K1", "torque 3". */
  readonly name = input.required<string>();
  /** Null for lists whose order carries no meaning (stations do): no move buttons. */
  readonly moves = input<MoveWords | null>(null);
  readonly isFirst = input(false);
  readonly isLast = input(false);
  readonly moved = output<-1 | 1>();
  readonly removed = output<void>();

  /** Back (up, left) then on (down, right); the ends of the list cannot move past it. */
  protected readonly moveButtons = computed(() => {
    const moves = this.moves();
    if (!moves) return [];
    const [back, on] = WORDS[moves];
    return [
      { step: -1 as const, icon: 'arrow_upward', label: `Move ${this.name()} ${back}`, isDisabled: this.isFirst() },
      { step: 1 as const, icon: 'arrow_downward', label: `Move ${this.name()} ${on}`, isDisabled: this.isLast() },
    ];
  });
}
