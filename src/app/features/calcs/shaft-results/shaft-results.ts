import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CalcResult } from '../../../../../shared/engine';
import { beamUnit, hasBeamModel } from '../../../../../shared/plots';
import { fmt } from '../editor/result-format';
import { ModelAssumptions } from './model-assumptions';
import { ResultTable, type ResultColumn } from './result-table';
import { loadRows, reactionRows } from './shaft-rows';

const AT_FY_FZ: ResultColumn[] = [
  { key: 'at', head: 'at' },
  { key: 'Fy', head: 'Fy' },
  { key: 'Fz', head: 'Fz' },
];
const REACTION_COLUMNS: ResultColumn[] = [
  ...AT_FY_FZ,
  { key: 'F', head: 'F radial' },
  { key: 'Fa', head: 'Fa axial' },
  { key: 'slope', head: 'slope' },
  { key: 'L10', head: 'L10' },
  { key: 'L10h', head: 'L10h' },
];
const LOAD_COLUMNS: ResultColumn[] = [
  ...AT_FY_FZ,
  { key: 'deflection', head: 'deflection' },
  { key: 'slope', head: 'slope' },
];

/**
 * Results of the whole-shaft model: bearing reactions and life, deflection and slope at each force,
 * the largest deflection and the first critical speed, with the model's assumptions beside them.
 * Shown in the editor (live) and on the calc page (stored result); nothing for a calc without bearings.
 */
@Component({
  selector: 'tt-shaft-results',
  imports: [ModelAssumptions, ResultTable],
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
  protected readonly reactionColumns = REACTION_COLUMNS;
  protected readonly loadColumns = LOAD_COLUMNS;
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
