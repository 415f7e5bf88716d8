import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormArray, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { UNIT_LABELS, type UnitSystem } from '../../../../../shared/engine/units';
import { featureTag } from '../../../../../shared/plots';
import { featureGroup, type FeatureForm, type FeatureType } from './row-forms';
import type { IssueMap } from './issue-map';
import { moveRow } from './row-moves';
import { RowActions } from './row-actions';
import { rowKey } from './row-keys';

type Field = { key: keyof FeatureForm; label: string; quantity: 'length' | 'stress' | null; isOptional: boolean };
const L = (key: keyof FeatureForm, label: string, isOptional = false): Field => ({
  key,
  label,
  quantity: 'length',
  isOptional,
});

/** The geometry each feature type needs (schema.ts); optional ones say so in their label. */
const FIELDS: Record<FeatureType, Field[]> = {
  'shoulder-fillet': [L('r', 'Fillet radius r')],
  keyseat: [
    L('r', 'Root r', true),
    L('width', 'Key width', true),
    L('height', 'Key height', true),
    L('length', 'Key length', true),
    { key: 'keySy', label: 'Key Sy', quantity: 'stress', isOptional: true },
  ],
  'ring-groove': [L('depth', 'Depth'), L('r', 'Root r'), L('width', 'Width', true)],
  'cross-hole': [L('diameter', 'Hole diameter')],
};

export const FEATURE_NAMES: Record<FeatureType, string> = {
  'shoulder-fillet': 'Shoulder fillet',
  keyseat: 'Keyseat',
  'ring-groove': 'Ring groove',
  'cross-hole': 'Cross hole',
};

/** Features at stations, each with the fields of its type and optional chart factors with their source. */
@Component({
  selector: 'tt-features-list',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    RowActions,
  ],
  templateUrl: './features-list.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FeaturesList {
  readonly rows = input.required<FormArray<FormGroup<FeatureForm>>>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();
  readonly canEdit = input(true);
  protected readonly rowKey = rowKey;

  protected readonly types = Object.entries(FEATURE_NAMES) as [FeatureType, string][];
  protected readonly labels = computed(() => UNIT_LABELS[this.units()]);
  protected readonly fieldsOf = FIELDS;
  protected readonly tag = featureTag;
  /** Stress concentration factors read off a chart; blank means the published fit computes them. */
  protected readonly chartFactors = ['Kt', 'Kts'] as const;

  protected unitOf(f: Field): string {
    return f.quantity ? this.labels()[f.quantity] : '';
  }

  protected issue(i: number, key: string): string | undefined {
    const engineKey = key === 'keySy' ? 'Sy' : key;
    return this.issues()[`features[${i}].${engineKey}`];
  }

  protected rowIssue(i: number): string | undefined {
    return this.issues()[`features[${i}]`];
  }

  protected add(type: FeatureType): void {
    this.rows().push(featureGroup({ type }));
  }

  protected remove(i: number): void {
    this.rows().removeAt(i);
  }

  protected move(i: number, step: -1 | 1): void {
    moveRow(this.rows(), i, step);
  }
}
