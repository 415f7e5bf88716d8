import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { Chart } from '../../../../shared/plots';
import { layoutChart } from './chart-layout';
import { describeChart, summariseChart } from './chart-summary';
import { hostWidth } from './element-width';

/**
 * One diagram along the shaft (torque, shear stress, twist) drawn as SVG in real pixels: hairline
 * grid, monospace ticks, the first series filled lightly down to zero, limits as dashed copper lines.
 */
@Component({
  selector: 'tt-diagram-chart',
  templateUrl: './diagram-chart.html',
  styleUrl: './diagram-chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiagramChart {
  readonly chart = input.required<Chart>();
  readonly height = input(210);

  private readonly width = hostWidth(640);
  protected readonly layout = computed(() => layoutChart(this.chart(), this.width(), this.height()));
  protected readonly ariaLabel = computed(() => describeChart(this.chart()));
  protected readonly summary = computed(() => summariseChart(this.chart()));
  protected readonly axisTitle = computed(() => `${this.chart().yLabel} [${this.chart().yUnit}]`);
  protected readonly stationTitle = computed(() => `${this.chart().xLabel} [${this.chart().xUnit}]`);
}
