import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormControl, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { UnitSystem } from '../../../../../shared/engine';
import type { IssueMap } from './issue-map';
import { massGroup, type MassForm } from './shaft-form';
import { shaftUnits, steelDensity } from './shaft-units';
import { StationTable, type StationTableSpec } from './station-table';

/** What the critical speed and bearing life need besides the forces: speed, the shaft's density, attached masses. */
@Component({
  selector: 'tt-dynamics-panel',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, StationTable],
  templateUrl: './dynamics-panel.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DynamicsPanel {
  readonly speed = input.required<FormControl<string>>();
  readonly density = input.required<FormControl<string>>();
  readonly masses = input.required<FormArray<FormGroup<MassForm>>>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();
  readonly canEdit = input(true);

  protected readonly u = computed(() => shaftUnits(this.units()) as Record<string, string>);
  /** The steel default the engine uses when density is blank, shown so the author knows what is assumed. */
  protected readonly steelDensity = computed(() => String(steelDensity(this.units())));
  protected readonly massTable = computed<StationTableSpec>(() => {
    const u = this.u();
    return {
      list: 'masses',
      caption: 'Attached masses',
      rowName: 'Mass',
      removeName: 'mass',
      tagPrefix: 'm',
      hasIndexHeadAligned: true,
      columns: [
        { key: 'at', head: 'Station', name: 'station', unit: u['length'] },
        { key: 'mass', head: 'Mass', name: 'mass', unit: u['mass'] },
      ],
    };
  });

  protected issue(path: string): string | undefined {
    return this.issues()[path];
  }

  protected add(): void {
    this.masses().push(massGroup());
  }
}
