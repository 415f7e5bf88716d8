import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { CalcResult } from '../../../../../shared/engine';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import { formatEng } from '../../../../../shared/format';
import { ShaftResults } from '../shaft-results/shaft-results';
import { MinimumDiameters } from './minimum-diameters';

/** The calc page's results tab: per-segment figures, the shaft model's results and the minimum diameters. */
@Component({
  selector: 'tt-results-tab',
  imports: [ShaftResults, MinimumDiameters],
  templateUrl: './results-tab.html',
  styles: `
    :host {
      display: block;
      padding: 14px 16px;
    }
    .small {
      font-size: 12px;
    }
    .results {
      border-collapse: collapse;
      width: 100%;
      font-size: 13px;
    }
    .results th,
    .results td {
      text-align: left;
      padding: 6px 10px;
      border-bottom: 1px solid var(--tt-rule);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsTab {
  readonly result = input.required<CalcResult>();
  readonly revision = input.required<RevisionDto>();
  protected readonly eng = formatEng;
}
