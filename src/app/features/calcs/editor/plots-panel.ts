import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { UNIT_LABELS } from '../../../../../shared/engine/units';
import {
  bendingPlot,
  deflectionPlot,
  hasBeamModel,
  shaftLoads,
  shearPlot,
  slopePlot,
  torquePlot,
  twistPlot,
  twistRatePlot,
} from '../../../../../shared/plots';
import { DiagramChart } from '../../../ui/plots/diagram-chart';
import { ShaftDrawing } from '../../../ui/plots/shaft-drawing';
import type { Evaluated } from './live-calc';
import { NO_LIMITS, type PlotLimits } from './plot-limits';

/**
 * The shaft to scale (with its bearings and forces) and the diagrams along it, with the standard's
 * limits drawn in. Bending, deflection and slope appear once the calc has bearings.
 */
@Component({
  selector: 'tt-plots-panel',
  imports: [DiagramChart, ShaftDrawing],
  template: `
    <tt-shaft-drawing [outline]="evaluated().outline" [unit]="lengthUnit()" [loads]="loads()" />
    <tt-diagram-chart [chart]="torque()" />
    @if (hasModel()) {
      <tt-diagram-chart [chart]="bending()" />
      <tt-diagram-chart [chart]="deflection()" />
      <tt-diagram-chart [chart]="slope()" />
    }
    <tt-diagram-chart [chart]="shear()" />
    <tt-diagram-chart [chart]="twist()" />
    <tt-diagram-chart [chart]="twistRate()" />
  `,
  styles: `
    :host {
      display: grid;
      gap: 18px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlotsPanel {
  readonly evaluated = input.required<Evaluated>();
  readonly limits = input<PlotLimits>(NO_LIMITS);

  protected readonly lengthUnit = computed(() => UNIT_LABELS[this.evaluated().result.units].length);
  protected readonly hasModel = computed(() => hasBeamModel(this.evaluated().result));
  protected readonly loads = computed(() =>
    this.hasModel() ? shaftLoads(this.evaluated().result, this.evaluated().outline) : null,
  );
  protected readonly torque = computed(() => torquePlot(this.evaluated().result));
  protected readonly bending = computed(() => bendingPlot(this.evaluated().result));
  protected readonly deflection = computed(() => deflectionPlot(this.evaluated().result, this.limits().deflection));
  protected readonly slope = computed(() => slopePlot(this.evaluated().result, this.limits().slope));
  protected readonly shear = computed(() => shearPlot(this.evaluated().result, this.limits().shear));
  protected readonly twist = computed(() => twistPlot(this.evaluated().result, this.limits().twist));
  protected readonly twistRate = computed(() => twistRatePlot(this.evaluated().result, this.limits().twistRate));
}
