import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { CalcResult, FeatureResult, SegmentResult } from '../../../../../shared/engine';
import { featureTag, hasBeamModel } from '../../../../../shared/plots';
import { fmt, unitOf, type CriterionKey } from './result-format';

/** Per-segment and per-feature results with their units, and the method behind every factor. */
@Component({
  selector: 'tt-results-tables',
  imports: [MatTableModule, MatTooltipModule],
  templateUrl: './results-tables.html',
  styleUrl: './results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsTables {
  readonly result = input.required<CalcResult>();
  readonly criterion = input<CriterionKey>('goodman');
  readonly criterionName = input('DE-Goodman');

  protected readonly fmt = fmt;
  protected readonly segmentColumns = ['seg', 'dia', 'J', 'T', 'tauMax', 'twist', 'twistPerLength', 'ny', 'nf'];
  // With bearings, the bending moment the model gives at each feature is shown beside its factors.
  protected readonly featureColumns = computed(() => [
    'tag',
    'at',
    ...(hasBeamModel(this.result()) ? ['M'] : []),
    'Kt',
    'Kts',
    'q',
    'Kf',
    'Kfs',
    'ny',
    'nf',
  ]);
  protected readonly u = computed(() => {
    const r = this.result();
    return Object.fromEntries(
      ['od', 'J', 'T', 'tauMax', 'twist', 'twistPerLength', 'at', 'M'].map((f) => [f, unitOf(r, f)]),
    );
  });
  protected readonly notchMethod = computed(() => this.result().features[0]?.method.notch ?? null);

  protected tag(f: FeatureResult): string {
    return featureTag(f.type as Parameters<typeof featureTag>[0], f.index);
  }

  protected diameter(s: SegmentResult): string {
    return s.isHollow ? `${fmt(s.od)} / ${fmt(s.id)}` : fmt(s.od);
  }

  protected fatigue(x: SegmentResult | FeatureResult): string {
    return x.fatigueSafety ? fmt(x.fatigueSafety[this.criterion()], 3) : '—';
  }

  /** Kt and Kts often come from the same table entry; say it once then. */
  protected methodText(f: FeatureResult): string {
    return f.method.Kt === f.method.Kts ? `Kt, Kts: ${f.method.Kt}` : `Kt: ${f.method.Kt}. Kts: ${f.method.Kts}`;
  }
}
