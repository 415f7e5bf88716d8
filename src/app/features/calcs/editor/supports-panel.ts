import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { UnitSystem } from '../../../../../shared/engine';
import type { IssueMap } from './issue-map';
import { BEARING_KINDS, BEARING_NAMES, supportGroup, type SupportForm } from './shaft-form';
import { shaftUnits } from './shaft-units';
import { RowActions } from './row-actions';
import { rowKey } from './row-keys';

/** The bearings: where each sits, its kind (which fixes the life exponent and the slope limit), C and location. */
@Component({
  selector: 'tt-supports-panel',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatCheckboxModule,
    MatButtonModule,
    MatIconModule,
    RowActions,
  ],
  templateUrl: './supports-panel.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SupportsPanel {
  readonly rows = input.required<FormArray<FormGroup<SupportForm>>>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();
  readonly canEdit = input(true);
  protected readonly rowKey = rowKey;

  protected readonly u = computed(() => shaftUnits(this.units()));
  protected readonly kinds = BEARING_KINDS;
  protected readonly kindNames = BEARING_NAMES;

  protected issue(i: number, key: string): string | undefined {
    return this.issues()[`supports[${i}].${key}`];
  }

  /** Messages about a whole row (two bearings at one station) or about the list (fewer than two). */
  protected rowIssue(i: number): string | undefined {
    return this.issues()[`supports[${i}]`];
  }

  protected add(): void {
    this.rows().push(supportGroup());
  }

  protected remove(i: number): void {
    this.rows().removeAt(i);
  }
}
