import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { formatNumber } from '../../../../shared/engine/number-format';
import type { ShaftLoads, ShaftOutline } from '../../../../shared/plots';
import { hostWidth } from './element-width';
import { layoutOutline } from './outline-layout';
import { LOADS_ROOM, layoutLoads } from './loads-layout';

/**
 * The shaft to scale: segments as drawn in a side view, bores as hidden lines, a centre line, and each
 * feature marked at its station with its tag (KS1, SF2 …) above the shaft; with `loads`, the bearings
 * and the forces on the shaft as arrows (reactions in ink, applied forces in blue).
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
  /** Bearings and forces of the whole-shaft model, or null for a calc without bearings. */
  readonly loads = input<ShaftLoads | null>(null);

  private readonly width = hostWidth(640);
  private readonly hasLoads = computed(
    () => !!this.loads() && (this.loads()!.arrows.length > 0 || this.loads()!.bearings.length > 0),
  );
  protected readonly layout = computed(() =>
    layoutOutline(this.outline(), this.width(), this.hasLoads() ? LOADS_ROOM : undefined),
  );
  protected readonly loadsLayout = computed(() => {
    const loads = this.loads();
    return loads && this.hasLoads() ? layoutLoads(loads, this.layout()) : null;
  });
  protected readonly f = (v: number): string => formatNumber(v, 4);

  protected readonly ariaLabel = computed(() => {
    const o = this.outline();
    const u = this.unit();
    const feats = o.features.map((x) => `${x.tag} ${x.name.toLowerCase()} at ${this.f(x.at)} ${u}`);
    return (
      `Shaft outline to scale: ${o.segments.length} segments, ${this.f(o.length)} ${u} long, largest diameter ` +
      `${this.f(2 * o.maxRadius)} ${u}${feats.length ? `; features: ${feats.join(', ')}` : '; no features'}` +
      `${this.loadWords()}.`
    );
  });

  private loadWords(): string {
    const l = this.loads();
    if (!l || !this.hasLoads()) return '';
    const bearings = l.bearings.map((b) => `${b.tag} at ${this.f(b.at)} ${this.unit()}`);
    return `; bearings ${bearings.join(', ')}; forces on the shaft: ${l.arrows.map((a) => a.name).join('; ')}`;
  }
}
