import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { Checklist, ChecklistRow } from '../../../../../shared/rules';
import { formatBeside, formatUtilisation, rowPath, unitText } from '../../../../../shared/format';
import type { FindingDto } from '../../../../../shared/schemas/calc-dto';

const STATUS_TEXT: Record<ChecklistRow['status'], string> = {
  pass: 'Pass',
  fail: 'Fail',
  'not-applicable': 'n/a',
  error: 'Error',
};

/** One row per clause and location: status, actual against limit, utilisation, clause reference. */
@Component({
  selector: 'tt-checklist-table',
  imports: [MatTableModule, MatTooltipModule],
  templateUrl: './checklist-table.html',
  styleUrl: './checklist-table.scss',
  // The table scrolls sideways inside itself on narrow screens; a keyboard user must be able to scroll it too.
  host: { tabindex: '0', role: 'region', 'aria-label': 'Checklist rows' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChecklistTable {
  readonly checklist = input.required<Checklist>();
  readonly showNotApplicable = input(false);
  /**
   * Findings raised on this revision: each shows on the row it is anchored to (clause-wide ones on the clause's first
   * row).
   */
  readonly findings = input<readonly FindingDto[]>([]);
  private readonly findingsByRow = computed(() => {
    const byRow = new Map<string, FindingDto[]>();
    for (const f of this.findings()) {
      if (!f.clauseRef) continue;
      const key = `${f.clauseRef}|${f.anchorPath ?? '*'}`;
      byRow.set(key, [...(byRow.get(key) ?? []), f]);
    }
    return byRow;
  });
  protected readonly hidden = computed(() => this.checklist().rows.length - this.rows().length);
  // Severity shows as a tag beside advisory clauses; mandatory is the norm and needs no column.
  protected readonly columns = ['clause', 'location', 'status', 'actual', 'limit', 'use'];

  // A row that does not apply stays in view when a finding is anchored to it ("this clause should apply here").
  protected readonly rows = computed(() =>
    this.checklist().rows.filter(
      (r) =>
        this.showNotApplicable() ||
        r.status !== 'not-applicable' ||
        this.findingsByRow().has(`${r.clauseId}|${rowPath(r.location) ?? '*'}`) ||
        this.findingsByRow().has(`${r.clauseId}|*`),
    ),
  );

  /** Rows come grouped by clause; the clause's name is printed once, on its first row. */
  protected isFirstOfClause(index: number): boolean {
    const rows = this.rows();
    return index === 0 || rows[index - 1].clauseId !== rows[index].clauseId;
  }

  protected findingsOn(row: ChecklistRow, index: number): FindingDto[] {
    const byRow = this.findingsByRow();
    const here = byRow.get(`${row.clauseId}|${rowPath(row.location) ?? '*'}`) ?? [];
    // A finding on the clause as a whole sits on its first row; a whole-shaft row already matched '*'.
    const clauseWide =
      rowPath(row.location) !== null && this.isFirstOfClause(index) ? (byRow.get(`${row.clauseId}|*`) ?? []) : [];
    return [...clauseWide, ...here];
  }

  /** An advisory failure says so in words, not only in a different colour. */
  protected statusLabel(row: ChecklistRow): string {
    return row.severity === 'advisory' && (row.status === 'fail' || row.status === 'error')
      ? `${STATUS_TEXT[row.status]} · advisory`
      : STATUS_TEXT[row.status];
  }

  /** Actual and limit with enough digits that the printed pair compares as the numbers do. */
  protected beside(row: ChecklistRow): { actual: string; limit: string } {
    return formatBeside(row.actual, row.limit);
  }

  protected unit(row: ChecklistRow): string {
    return row.actual === null && row.limit === null ? '' : unitText(row.unit);
  }

  protected utilisation(row: ChecklistRow): string {
    return formatUtilisation(row.utilisation);
  }

  protected barWidth(row: ChecklistRow): number {
    return Math.max(0, Math.min(100, (row.utilisation ?? 0) * 100));
  }
}
