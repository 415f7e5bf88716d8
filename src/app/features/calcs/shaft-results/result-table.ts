import { booleanAttribute, ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';

/** One column of figures: the row's key (which also names its unit) and its header word. */
export interface ResultColumn {
  key: string;
  head: string;
}

/** A row of display text: the element's tag and name, then one figure (text) per column key. */
export interface ResultRow {
  tag: string;
  name: string;
}

/**
 * One whole-shaft results table under its heading: the element (tag and name) in the first column, then its
 * figures with their units in the headers. It scrolls sideways on its own on a narrow screen.
 */
@Component({
  selector: 'tt-result-table',
  imports: [MatTableModule],
  template: `
    <h3 class="sub">{{ caption() }}</h3>
    <div class="scroll" tabindex="0" role="region" [attr.aria-label]="caption() + ', scrolls sideways'">
      <table mat-table [dataSource]="rows()" class="results" [attr.aria-label]="caption()">
        <ng-container matColumnDef="tag">
          <th mat-header-cell *matHeaderCellDef>{{ element() }}</th>
          <td mat-cell *matCellDef="let row" class="name">
            <span class="tt-mono tag" [class.applied]="isApplied()">{{ row.tag }}</span> {{ row.name }}
          </td>
        </ng-container>
        @for (c of columns(); track c.key) {
          <ng-container [matColumnDef]="c.key">
            <th mat-header-cell *matHeaderCellDef class="num">{{ c.head }} {{ unitOf(c.key) }}</th>
            <td mat-cell *matCellDef="let row" class="num">{{ row[c.key] }}</td>
          </ng-container>
        }
        <tr mat-header-row *matHeaderRowDef="shown()"></tr>
        <tr mat-row *matRowDef="let row; columns: shown()"></tr>
      </table>
    </div>
  `,
  styleUrl: '../editor/results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultTable {
  /** The heading, also the table's and the scroll region's accessible name. */
  readonly caption = input.required<string>();
  /** What the first column lists: "Bearing", "Force". */
  readonly element = input.required<string>();
  readonly rows = input.required<readonly ResultRow[]>();
  readonly columns = input.required<readonly ResultColumn[]>();
  /** The unit of a figure by its key, "" for a plain number. */
  readonly unit = input.required<(key: string) => string>();
  /** Forces are tagged as applied loads, bearings as supports. */
  readonly isApplied = input(false, { transform: booleanAttribute });

  protected readonly shown = computed(() => ['tag', ...this.columns().map((c) => c.key)]);

  protected unitOf(key: string): string {
    const unit = this.unit()(key);
    return unit ? `[${unit}]` : '';
  }
}
