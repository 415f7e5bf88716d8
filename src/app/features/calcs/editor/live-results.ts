import { ChangeDetectionStrategy, Component, DOCUMENT, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CalcIssue } from '../../../../../shared/engine';
import type { Checklist, RuleSet } from '../../../../../shared/rules';
import { SafetyNote } from '../../../ui/safety-note';
import { placeOf } from './issue-map';
import type { Evaluated } from './live-calc';
import { PlotsPanel } from './plots-panel';
import { NO_LIMITS, type PlotLimits } from './plot-limits';
import { ResultSummary } from './result-summary';
import { PanelPacer } from './panel-pacer';
import type { CriterionKey } from './result-format';

/** What is computed live from the input and read at a glance: issues, key figures and the plots. */
@Component({
  selector: 'tt-live-results',
  imports: [MatIconModule, SafetyNote, PlotsPanel, ResultSummary],
  templateUrl: './live-results.html',
  styleUrl: './results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LiveResults {
  private readonly document = inject(DOCUMENT);
  private readonly pacer = inject(PanelPacer, { optional: true });
  /** The plots are built in their turn after the fields (or when scrolled to), see PanelPacer. */
  protected readonly plotsTurn = computed(() => this.pacer?.reached(8) ?? true);

  readonly issues = input.required<readonly CalcIssue[]>();
  readonly evaluated = input.required<Evaluated | null>();
  readonly isStale = input.required<boolean>();
  readonly limits = input<PlotLimits | undefined>(undefined);
  readonly criterion = input<CriterionKey>('goodman');
  readonly criterionName = input('DE-Goodman');
  readonly checklist = input<Checklist | null>(null);
  readonly ruleSet = input<RuleSet | null>(null);

  protected readonly noLimits = NO_LIMITS;
  private readonly featureTypes = computed(() =>
    ((this.evaluated()?.input as { features?: { type: string }[] } | undefined)?.features ?? []).map((f) => f.type),
  );
  protected readonly listed = computed(() =>
    this.issues().map((i) => ({ ...i, place: placeOf(i.path, this.featureTypes()) })),
  );
  protected readonly warnings = computed(() =>
    (this.evaluated()?.result.warnings ?? []).map((w) => ({ ...w, place: placeOf(w.path, this.featureTypes()) })),
  );

  /** Takes the author to the field an issue names, where the same message is shown. */
  protected async focusField(path: string): Promise<void> {
    const selector = `[data-path=${JSON.stringify(path)}]`;
    // A field of a panel not built yet: build the panels, then go to it.
    const el = this.document.querySelector<HTMLElement>(selector) ?? (await this.pacer?.reveal(selector)) ?? null;
    el?.focus();
    el?.scrollIntoView({ block: 'center' });
  }
}
