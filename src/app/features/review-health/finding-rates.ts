import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';
import { PAIR_RATES_LISTED, type FindingRate } from '../../../../shared/schemas/review-health.schema';

/** Finding rates, per checker or per author–checker pair: counts of checks in the period, not judgements. */
@Component({
  selector: 'tt-finding-rates',
  imports: [DecimalPipe, MatTableModule],
  template: `
    @if (limitedNote(); as note) {
      <p class="limited">{{ note }}</p>
    }
    <div class="tt-scroll-x" tabindex="0" role="region" [attr.aria-label]="caption() + ', scrolls sideways'">
      <table mat-table [dataSource]="rates()" [attr.aria-label]="caption()">
        <ng-container matColumnDef="checker"
          ><th mat-header-cell *matHeaderCellDef>Checker</th>
          <td mat-cell *matCellDef="let r">{{ r.checkerName }}</td></ng-container
        >
        <ng-container matColumnDef="author"
          ><th mat-header-cell *matHeaderCellDef>Author</th>
          <td mat-cell *matCellDef="let r">{{ r.authorName }}</td></ng-container
        >
        <ng-container matColumnDef="checks"
          ><th mat-header-cell *matHeaderCellDef class="num">Checks</th>
          <td mat-cell *matCellDef="let r" class="num">{{ r.checks }}</td></ng-container
        >
        <ng-container matColumnDef="withFindings">
          <th mat-header-cell *matHeaderCellDef class="num">With findings</th>
          <td mat-cell *matCellDef="let r" class="num">
            {{ r.checksWithFindings }} ({{ (r.checks ? (100 * r.checksWithFindings) / r.checks : 0) | number: '1.0-0' }}
            %)
          </td>
        </ng-container>
        <ng-container matColumnDef="findings"
          ><th mat-header-cell *matHeaderCellDef class="num">Findings</th>
          <td mat-cell *matCellDef="let r" class="num">{{ r.findings }}</td></ng-container
        >
        <tr mat-header-row *matHeaderRowDef="columns()"></tr>
        <tr mat-row *matRowDef="let row; columns: columns()"></tr>
        <tr class="mat-row" *matNoDataRow>
          <td class="empty" [attr.colspan]="columns().length">No checks signed in this period.</td>
        </tr>
      </table>
    </div>
  `,
  styles: `
    :host {
      display: block;
      max-width: 100%;
    }
    .num {
      text-align: right;
      white-space: nowrap;
    }
    .limited {
      margin: 0 0 8px;
      color: var(--tt-ink-soft);
    }
    .empty {
      padding: 12px 16px;
      color: var(--tt-ink-soft);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FindingRates {
  readonly rates = input.required<FindingRate[]>();
  readonly byPair = input(false);
  readonly caption = input.required<string>();
  /** How many rows there are in all, when only some are listed. */
  readonly total = input(0);
  /** Said when the list is limited: how many of how many, which ones, and where the rest are. */
  protected readonly limitedNote = computed(() => {
    const [listed, total] = [this.rates().length, this.total()];
    if (total <= listed) return null;
    return (
      `${listed.toLocaleString('en-US')} of ${total.toLocaleString('en-US')} pairs listed: the ${PAIR_RATES_LISTED} ` +
      'with the most checks, and every pair past a set threshold (checks without a finding, or one checker’s share ' +
      'of an author’s checks). The CSV export has every pair.'
    );
  });
  protected readonly columns = computed(() =>
    this.byPair()
      ? ['author', 'checker', 'checks', 'withFindings', 'findings']
      : ['checker', 'checks', 'withFindings', 'findings'],
  );
}
