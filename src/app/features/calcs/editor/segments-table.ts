import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { UNIT_LABELS, type UnitSystem } from '../../../../../shared/engine/units';
import { segmentGroup, type SegmentForm } from './row-forms';
import type { IssueMap } from './issue-map';
import { moveRow } from './row-moves';
import { RowActions } from './row-actions';
import { rowKey } from './row-keys';

const FIELDS = ['length', 'od', 'id'] as const;
const NAMES: Record<(typeof FIELDS)[number], string> = { length: 'length', od: 'outer diameter', id: 'inner diameter' };
const LABELS: Record<string, string> = { length: 'Length', od: 'Outer ⌀', id: 'Inner ⌀', label: 'Label' };

/** The shaft's segments from left to right: an editable table with add, remove and reorder. */
@Component({
  selector: 'tt-segments-table',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    MatTooltipModule,
    RowActions,
  ],
  templateUrl: './segments-table.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SegmentsTable {
  readonly rows = input.required<FormArray<FormGroup<SegmentForm>>>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();
  readonly canEdit = input(true);
  protected readonly rowKey = rowKey;

  protected readonly len = computed(() => UNIT_LABELS[this.units()].length);
  protected readonly fields = FIELDS;
  protected readonly names = NAMES;

  protected issue(i: number, key: string): string | undefined {
    return this.issues()[`segments[${i}].${key}`];
  }

  /**
   * Every message about row i, written under the row across the table: a table cell is too narrow for
   * "inner diameter 120 mm is not smaller than outer diameter 110 mm". The field itself turns red.
   */
  protected rowIssues(i: number): string[] {
    const prefix = `segments[${i}]`;
    return Object.entries(this.issues())
      .filter(([p]) => p === prefix || p.startsWith(`${prefix}.`))
      .map(([p, m]) => `${LABELS[p.slice(prefix.length + 1)] ?? (p.slice(prefix.length + 1) || 'Segment')}: ${m}`);
  }

  protected add(): void {
    const last = this.rows().length
      ? this.rows()
          .at(this.rows().length - 1)
          .getRawValue()
      : undefined;
    // A new segment starts like the last one, which is usually the next step's neighbour.
    this.rows().push(segmentGroup(last ? { od: last.od, id: last.id } : {}));
  }

  protected remove(i: number): void {
    this.rows().removeAt(i);
  }

  protected move(i: number, step: -1 | 1): void {
    moveRow(this.rows(), i, step);
  }
}
