import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { UNIT_LABELS, type UnitSystem } from '../../../../../shared/engine/units';
import { bendingGroup, torqueGroup, type BendingForm, type TorqueForm } from './row-forms';
import type { IssueMap } from './issue-map';
import { RowActions } from './row-actions';
import { StationTable, type StationTableSpec } from './station-table';
import { rowKey } from './row-keys';

/** Load cases: external torques (or power at a speed) at stations, and bending moments for fatigue. Their
 * order carries no meaning (stations do), so rows are added and removed but not reordered. */
@Component({
  selector: 'tt-loads-panel',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatIconModule,
    RowActions,
    StationTable,
  ],
  templateUrl: './loads-panel.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadsPanel {
  readonly torques = input.required<FormArray<FormGroup<TorqueForm>>>();
  readonly bending = input.required<FormArray<FormGroup<BendingForm>>>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();
  readonly canEdit = input(true);
  protected readonly rowKey = rowKey;

  protected readonly u = computed(() => UNIT_LABELS[this.units()]);
  protected readonly bendingTable = computed<StationTableSpec>(() => {
    const u = this.u();
    return {
      list: 'bending',
      caption: 'Bending moments',
      rowName: 'Bending',
      removeName: 'moment',
      tagPrefix: '',
      hasIndexHeadAligned: false,
      columns: [
        { key: 'at', head: 'Station', name: 'station', unit: u.length },
        { key: 'Ma', head: 'Ma', name: 'alternating moment Ma', unit: u.torque },
        { key: 'Mm', head: 'Mm', name: 'midrange moment Mm', unit: u.torque, placeholder: '0' },
      ],
    };
  });

  protected issue(i: number, key: string): string | undefined {
    return this.issues()[`torques[${i}].${key}`];
  }

  protected addTorque(): void {
    this.torques().push(torqueGroup());
  }

  protected addBending(): void {
    this.bending().push(bendingGroup());
  }

  protected removeTorque(i: number): void {
    this.torques().removeAt(i);
  }
}
