import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ChecklistPanel } from './checklist-panel';
import type { ChecklistState, Evaluated } from './live-calc';
import { ResultsTables } from './results-tables';
import { ShaftResults } from '../shaft-results/shaft-results';
import type { CriterionKey } from './result-format';

/** The wide part of the live results, below the form: tables per segment and feature, and the checklist. */
@Component({
  selector: 'tt-live-details',
  imports: [ChecklistPanel, ResultsTables, ShaftResults],
  template: `
    @if (evaluated(); as ev) {
      <div class="details" [class.is-stale]="isStale()">
        <section aria-labelledby="results-h">
          <h2 id="results-h">
            Results
            <span class="tt-muted engine"
              >engine {{ ev.result.engineVersion }} · {{ ev.result.units
              }}{{ isStale() ? ' · for the last valid input' : '' }}</span
            >
          </h2>
          <tt-shaft-results [result]="ev.result" />
          <tt-results-tables [result]="ev.result" [criterion]="criterion()" [criterionName]="criterionName()" />
        </section>
        <section aria-labelledby="checklist-h">
          <h2 id="checklist-h">Checklist</h2>
          <tt-checklist-panel [state]="checklist()" [problem]="ruleSetProblem()" />
        </section>
      </div>
    }
  `,
  styleUrl: './results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LiveDetails {
  readonly evaluated = input.required<Evaluated | null>();
  readonly isStale = input.required<boolean>();
  readonly checklist = input.required<ChecklistState>();
  readonly ruleSetProblem = input<string | null>(null);
  readonly criterion = input<CriterionKey>('goodman');
  readonly criterionName = input('DE-Goodman');
}
