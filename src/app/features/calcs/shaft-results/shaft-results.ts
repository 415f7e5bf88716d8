import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import type { CalcResult } from '../../../../../shared/engine';
import { beamUnit, hasBeamModel } from '../../../../../shared/plots';
import { fmt } from '../editor/result-format';
import { ModelAssumptions } from './model-assumptions';
import { loadRows, reactionRows } from './shaft-rows';

/**
 * Results of the whole-shaft model: bearing reactions and life, deflection and slope at each force,
 * the largest deflection and the first critical speed, with the model's assumptions beside them.
 * Shown in the editor (live) and on the calc page (stored result); nothing for a calc without bearings.
 */
@Component({
  selector: 'tt-shaft-results',
  imports: [MatTableModule, ModelAssumptions],
  templateUrl: './shaft-results.html',
  styleUrl: '../editor/results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShaftResults {
  readonly result = input.required<CalcResult>();

  protected readonly fmt = fmt;
  protected readonly hasModel = computed(() => hasBeamModel(this.result()));
  protected readonly reactions = computed(() => reactionRows(this.result()));
  protected readonly loads = computed(() => loadRows(this.result()));
  protected readonly reactionColumns = ['tag', 'at', 'Fy', 'Fz', 'F', 'Fa', 'slope', 'L10', 'L10h'];
  protected readonly loadColumns = ['tag', 'at', 'Fy', 'Fz', 'deflection', 'slope'];
  protected readonly unit = computed(() => {
    const r = this.result();
    return (key: string) => beamUnit(r, key);
  });
  /** Who says so, for the figures that come from a published method (critical speed, bearing life). */
  protected readonly methods = computed(() => {
    const f = this.result().fields;
    return ['rpm', 'L10h'].map((k) => f[k]?.formula).filter((v): v is string => !!v);
  });
}
