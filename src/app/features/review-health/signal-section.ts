import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatIconModule } from '@angular/material/icon';
import type { SignalKey, SignalRow } from '../../../../shared/schemas/review-health.schema';
import { SIGNAL_TEXTS } from '../../../../shared/review-health/signal-texts';

/** One signal: what it observes, what it cannot tell, and its rows with links to the trail behind them. */
@Component({
  selector: 'tt-signal-section',
  imports: [DatePipe, RouterLink, MatIconModule],
  template: `
    <section class="signal" [attr.aria-labelledby]="'signal-' + key()">
      <header>
        <h2 [id]="'signal-' + key()">{{ text().title }}</h2>
        <span class="count" [class.none]="rows().length === 0">{{ countText() }}</span>
      </header>
      <p class="meaning">{{ text().meaning }}</p>
      <p class="limits">
        <mat-icon aria-hidden="true">info</mat-icon><span><strong>Limits:</strong> {{ text().limits }}</span>
      </p>
      @if (rows().length === 0) {
        <p class="tt-muted nothing">Nothing observed in this period.</p>
      } @else {
        <ul class="rows">
          @for (r of rows(); track $index) {
            <li>
              <div class="fact">{{ r.fact }}</div>
              <div class="meta">
                @if (r.calcId) {
                  <a [routerLink]="['/calcs', r.calcId]"
                    >{{ r.projectCode }} · {{ r.calcNumber }} rev {{ r.revision }}</a
                  >
                }
                @if (r.people) {
                  <span>{{ r.people }}</span>
                }
                @if (r.at) {
                  <span class="tt-mono">{{ r.at | date: 'y-MM-dd HH:mm' : 'UTC' }} UTC</span>
                }
              </div>
              <div class="evidence">
                @for (e of r.evidence; track e.label) {
                  <a [routerLink]="'/audit'" [queryParams]="e.query"
                    ><mat-icon aria-hidden="true">fact_check</mat-icon>{{ e.label }}</a
                  >
                }
              </div>
            </li>
          }
        </ul>
        @if (more()) {
          <p class="tt-muted">
            Only the first {{ rows().length }} are listed; narrow the period or choose a project, or export the CSV.
          </p>
        }
      }
    </section>
  `,
  styleUrl: './signal-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignalSection {
  readonly key = input.required<SignalKey>();
  readonly rows = input.required<SignalRow[]>();
  readonly more = input(false);
  protected readonly text = computed(() => SIGNAL_TEXTS[this.key()]);
  protected readonly countText = computed(() =>
    this.rows().length === 1 ? '1 observation' : `${this.rows().length} observations`,
  );
}
