import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { UNIT_LABELS, type UnitSystem } from '../../../../../shared/engine';
import { bendingGroup, torqueGroup, type BendingForm, type TorqueForm } from './editor-form';
import type { IssueMap } from './issue-map';

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

  protected readonly u = computed(() => UNIT_LABELS[this.units()]);

  protected issue(list: 'torques' | 'bending', i: number, key: string): string | undefined {
    return this.issues()[`${list}[${i}].${key}`];
  }

  protected addTorque(): void {
    this.torques().push(torqueGroup());
  }

  protected addBending(): void {
    this.bending().push(bendingGroup());
  }

  protected remove(list: FormArray, i: number): void {
    list.removeAt(i);
  }
}
