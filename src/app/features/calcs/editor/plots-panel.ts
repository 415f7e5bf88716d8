import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { UNIT_LABELS } from '../../../../../shared/engine';
import { shearPlot, torquePlot, twistPlot, twistRatePlot } from '../../../../../shared/plots';
import { DiagramChart } from '../../../ui/plots/diagram-chart';
import { ShaftDrawing } from '../../../ui/plots/shaft-drawing';
import type { Evaluated } from './live-calc';
import type { PlotLimits } from './plot-limits';

/** The shaft to scale and the diagrams along it, with the standard's limits drawn in. */
@Component({
  selector: 'tt-plots-panel',
  imports: [DiagramChart, ShaftDrawing],
  template: `
    <tt-shaft-drawing [outline]="evaluated().outline" [unit]="lengthUnit()" />
    <tt-diagram-chart [chart]="torque()" />
    <tt-diagram-chart [chart]="shear()" />
    <tt-diagram-chart [chart]="twist()" />
    <tt-diagram-chart [chart]="twistRate()" />
  `,
  styles: `:host { display: grid; gap: 18px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlotsPanel {
  readonly evaluated = input.required<Evaluated>();
  readonly limits = input<PlotLimits>({ shear: [], twist: [], twistRate: [] });

  protected readonly lengthUnit = computed(() => UNIT_LABELS[this.evaluated().result.units].length);
  protected readonly torque = computed(() => torquePlot(this.evaluated().result));
  protected readonly shear = computed(() => shearPlot(this.evaluated().result, this.limits().shear));
  protected readonly twist = computed(() => twistPlot(this.evaluated().result, this.limits().twist));
  protected readonly twistRate = computed(() => twistRatePlot(this.evaluated().result, this.limits().twistRate));
}
