import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { formatNumber } from '../../../../shared/engine';
import type { ShaftOutline } from '../../../../shared/plots';
import { hostWidth } from './element-width';
import { layoutOutline } from './outline-layout';

/**
 * The shaft to scale: segments as drawn in a side view, bores as hidden lines, a centre line, and each
 * feature marked at its station with its tag (KS1, SF2 …) above the shaft.
 */
@Component({
  selector: 'tt-shaft-drawing',
  templateUrl: './shaft-drawing.html',
  styleUrl: './shaft-drawing.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShaftDrawing {
  readonly outline = input.required<ShaftOutline>();
  /** Length unit of the calc (mm or in). */
  readonly unit = input.required<string>();

  private readonly width = hostWidth(640);
  protected readonly layout = computed(() => layoutOutline(this.outline(), this.width()));
  protected readonly f = (v: number): string => formatNumber(v, 4);

  protected readonly ariaLabel = computed(() => {
    const o = this.outline();
    const u = this.unit();
    const feats = o.features.map((x) => `${x.tag} ${x.name.toLowerCase()} at ${this.f(x.at)} ${u}`);
    return `Shaft outline to scale: ${o.segments.length} segments, ${this.f(o.length)} ${u} long, largest diameter `
      + `${this.f(2 * o.maxRadius)} ${u}${feats.length ? `; features: ${feats.join(', ')}` : '; no features'}.`;
  });
}
