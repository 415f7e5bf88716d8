import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { IssueMap } from './issue-map';
import { RowActions } from './row-actions';
import { rowKey } from './row-keys';

/** One number column: the form control's key, its header word, how a screen reader names it, its unit. */
export interface StationColumn {
  key: string;
  head: string;
  name: string;
  unit: string;
  placeholder?: string;
}

/** What a table of rows at stations shows and how it names them (bending moments, attached masses). */
export interface StationTableSpec {
  /** The list's name in the calc input, which is also how the engine's messages name its rows. */
  list: string;
  caption: string;
  /** "Bending 2 station in mm", "Mass 2 label". */
  rowName: string;
  /** "Remove moment 2". */
  removeName: string;
  /** Printed before the row number ("m1"). */
  tagPrefix: string;
  columns: readonly StationColumn[];
  /** The "#" header set like the numbers below it; the bending table's has always sat at the left. */
  hasIndexHeadAligned: boolean;
}

/**
 * A table of rows placed at stations along the shaft: numbers, a label, and a remove button. Order carries no
 * meaning (stations do), so rows are added by the panel and removed here, never reordered.
 */
@Component({
  selector: 'tt-station-table',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, RowActions],
  templateUrl: './station-table.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationTable {
  readonly rows = input.required<FormArray<FormGroup>>();
  readonly spec = input.required<StationTableSpec>();
  readonly issues = input.required<IssueMap>();
  readonly canEdit = input(true);
  protected readonly rowKey = rowKey;

  protected path(i: number, key: string): string {
    return `${this.spec().list}[${i}].${key}`;
  }

  protected remove(i: number): void {
    this.rows().removeAt(i);
  }
}
