import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { UnitSystem } from '../../../../../shared/engine';
import type { IssueMap } from './issue-map';
import { FORCE_KINDS, FORCE_NAMES, forceGroup, type ForceForm, type ForceKind } from './shaft-form';
import { shaftUnits } from './shaft-units';
import { RowActions } from './row-actions';
import { rowKey } from './row-keys';

interface Field {
  key: keyof ForceForm;
  label: string;
  unit: keyof ReturnType<typeof shaftUnits> | 'deg' | '';
  hint?: string;
}

const FORCE_XYZ: Field[] = [
  { key: 'Fy', label: 'Fy', unit: 'force' },
  { key: 'Fz', label: 'Fz', unit: 'force' },
  { key: 'Fx', label: 'Fx axial', unit: 'force' },
];
const OWN_T: Field = { key: 'T', label: 'T', unit: 'torque', hint: 'blank: torque entry here' };
const DIRECTION: Field = { key: 'direction', label: 'Direction', unit: 'deg', hint: 'pull, from +y to +z' };

/** The fields each kind of element asks for, in the order an engineer reads them off a drawing. */
const FIELDS: Record<ForceKind, Field[]> = {
  point: FORCE_XYZ,
  gear: [
    { key: 'pitchDiameter', label: 'Pitch ⌀', unit: 'length' },
    { key: 'pressureAngle', label: 'Pressure angle', unit: 'deg', hint: 'blank: 20°' },
    { key: 'helixAngle', label: 'Helix angle', unit: 'deg', hint: 'blank: 0° (spur)' },
    { ...DIRECTION, hint: 'mesh, from +y to +z' },
    OWN_T,
  ],
  pulley: [
    { key: 'diameter', label: 'Pitch ⌀', unit: 'length' },
    { key: 'pullFactor', label: 'Pull factor', unit: '', hint: 'blank: 1.5 (V-belt)' },
    DIRECTION,
    OWN_T,
  ],
  sprocket: [
    { key: 'diameter', label: 'Pitch ⌀', unit: 'length' },
    { key: 'pullFactor', label: 'Pull factor', unit: '', hint: 'blank: 1 (chain)' },
    DIRECTION,
    OWN_T,
  ],
  coupling: [...FORCE_XYZ.slice(0, 2).map((f) => ({ ...f, hint: 'blank: 0' })), OWN_T],
};

const TAGS: Record<ForceKind, string> = { point: 'F', gear: 'G', pulley: 'P', sprocket: 'S', coupling: 'C' };

/**
 * Forces on the shaft: entered directly in y and z, or produced by a gear, pulley, sprocket or coupling
 * from the torque it passes on. The engine works out the components; the live plot draws them.
 */
@Component({
  selector: 'tt-forces-panel',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    RowActions,
  ],
  templateUrl: './forces-panel.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForcesPanel {
  readonly rows = input.required<FormArray<FormGroup<ForceForm>>>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();
  readonly canEdit = input(true);
  protected readonly rowKey = rowKey;

  protected readonly u = computed(() => shaftUnits(this.units()) as Record<string, string>);
  protected readonly kinds = FORCE_KINDS;
  protected readonly kindNames = FORCE_NAMES;

  protected fieldsOf(kind: ForceKind): Field[] {
    return FIELDS[kind];
  }

  protected unitOf(f: Field): string {
    return f.unit === 'deg' ? '°' : f.unit ? this.u()[f.unit] : '';
  }

  protected tag(kind: ForceKind, i: number): string {
    return `${TAGS[kind]}${i + 1}`;
  }

  protected issue(i: number, key: string): string | undefined {
    return this.issues()[`loads[${i}].${key}`];
  }

  protected add(): void {
    this.rows().push(forceGroup());
  }

  protected remove(i: number): void {
    this.rows().removeAt(i);
  }
}
