import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { Checklist, ChecklistRow } from '../../../../../shared/rules';

const STATUS_TEXT: Record<ChecklistRow['status'], string> = { pass: 'Pass', fail: 'Fail', 'not-applicable': 'n/a', error: 'Error' };

/** One row per clause and location: status, actual against limit, utilisation, clause reference. */
@Component({
  selector: 'tt-checklist-table',
  imports: [DecimalPipe, MatTableModule, MatTooltipModule],
  templateUrl: './checklist-table.html',
  styleUrl: './checklist-table.scss',
  // The host scrolls sideways on narrow screens; focusable so keyboard users can scroll it too.
  host: { tabindex: '0', role: 'region', 'aria-label': 'Checklist rows, scrolls sideways' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChecklistTable {
  readonly checklist = input.required<Checklist>();
  readonly showNotApplicable = input(false);
  protected readonly rows = computed(() =>
    this.checklist().rows.filter((r) => this.showNotApplicable() || r.status !== 'not-applicable'));
  protected readonly hidden = computed(() => this.checklist().rows.length - this.rows().length);
  // Severity shows as a tag beside advisory clauses; mandatory is the norm and needs no column.
  protected readonly columns = ['clause', 'location', 'status', 'actual', 'limit', 'use'];

  /** Rows come grouped by clause; the clause's name is printed once, on its first row. */
  protected isFirstOfClause(index: number): boolean {
    const rows = this.rows();
    return index === 0 || rows[index - 1].clauseId !== rows[index].clauseId;
  }

  protected statusLabel(row: ChecklistRow): string {
    return STATUS_TEXT[row.status];
  }

  protected barWidth(row: ChecklistRow): number {
    return Math.max(0, Math.min(100, (row.utilisation ?? 0) * 100));
  }
}
