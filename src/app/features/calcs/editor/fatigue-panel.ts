import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type FormGroup } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { UNIT_LABELS, type UnitSystem } from '../../../../../shared/engine/units';
import type { RuleSetMethods } from '../../../../../shared/rules';
import type { FatigueForm } from './editor-form';
import type { IssueMap } from './issue-map';

/** Fatigue settings: Marin factors (Shigley Eq. 6-18) and the alternating share of the torque. */
@Component({
  selector: 'tt-fatigue-panel',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatCheckboxModule],
  templateUrl: './fatigue-panel.html',
  styleUrl: './editor-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FatiguePanel {
  readonly group = input.required<FormGroup<FatigueForm>>();
  readonly isEnabled = input.required<boolean>();
  readonly units = input.required<UnitSystem>();
  readonly issues = input.required<IssueMap>();
  /** Methods the design standard imposes; they override the author's choice in the evaluation. */
  readonly imposed = input<RuleSetMethods | null>(null);

  protected readonly u = computed(() => UNIT_LABELS[this.units()]);
  protected readonly surfaces = ['ground', 'machined', 'cold-drawn', 'hot-rolled', 'as-forged'];
  protected readonly reliabilities = ['50', '90', '95', '99', '99.9', '99.99'];
  // Marin factors by name as the method writes them; a blank field means the engine computes or takes the default.
  protected readonly factorKeys = ['kd', 'kc', 'kf'] as const;
  protected readonly factorNames = { kd: 'Temperature factor kd', kc: 'Load factor kc', kf: 'Miscellaneous factor kf' };
  protected readonly factorDefaults = { kd: 'from the temperature', kc: '1, stresses combined', kf: '1' };
  protected readonly imposedText = computed(() => {
    const m = this.imposed();
    if (!m) return null;
    const parts = [
      `Table 6-2 ${m.surfaceTable} edition`,
      m.kfOnMidrange ? 'Kf on midrange stresses' : 'no Kf on midrange stresses',
    ];
    if (m.reliability !== undefined) parts.push(`${m.reliability} % reliability`);
    return `${parts.join(', ')}; criterion ${m.fatigueCriterion}`;
  });

  protected issue(key: string): string | undefined {
    return this.issues()[`fatigue.${key}`];
  }
}
