import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { SignalPage } from '../../../../shared/schemas/review-health.schema';
import { SIGNAL_TEXTS } from '../../../../shared/review-health/signal-texts';
import { assertApiFailure } from '../../core/http/api-failure';
import { ReviewHealthApi, type HealthParams } from './review-health-api';

/** One signal: what it observes, what it cannot tell, and its rows with links to the trail behind them. */
@Component({
  selector: 'tt-signal-section',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule],
  template: `
    <section class="signal" [attr.aria-labelledby]="'signal-' + key()" [attr.aria-busy]="isLoading()">
      <header>
        <h2 [id]="'signal-' + key()">{{ text().title }}</h2>
        <span class="count" [class.none]="page().total === 0">{{ countText() }}</span>
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
        @if (next() || problem()) {
          <div class="more">
            <span class="tt-muted" role="status">{{ shownText() }}</span>
            @if (next()) {
              <button mat-stroked-button type="button" (click)="showMore()" [disabled]="isLoading()">
                Show {{ nextSize() }} more
              </button>
            }
            @if (problem(); as m) {
              <span class="error" role="alert">{{ m }}</span>
            }
          </div>
        }
      }
    </section>
  `,
  styleUrl: './signal-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignalSection {
  private readonly api = inject(ReviewHealthApi);
  /** The signal's first page, as the report carries it. */
  readonly page = input.required<SignalPage>();
  /** The project and period the report was read for; later pages are asked for the same. */
  readonly params = input.required<HealthParams>();
  protected readonly key = computed(() => this.page().key);
  protected readonly text = computed(() => SIGNAL_TEXTS[this.key()]);
  /** The rows shown so far and where the list continues; a new report starts them again. */
  protected readonly rows = linkedSignal(() => this.page().rows);
  protected readonly next = linkedSignal(() => this.page().next);
  protected readonly isLoading = signal(false);
  protected readonly problem = linkedSignal<SignalPage, string | null>({ source: this.page, computation: () => null });
  protected readonly countText = computed(() => {
    const n = this.page().total;
    return `${n.toLocaleString('en-GB')} observation${n === 1 ? '' : 's'}`;
  });
  protected readonly shownText = computed(
    () =>
      `${this.rows().length.toLocaleString('en-GB')} of ${this.page().total.toLocaleString('en-GB')} shown; ` +
      'the CSV export has every one.',
  );
  protected readonly nextSize = computed(() =>
    Math.min(this.page().rows.length, this.page().total - this.rows().length),
  );

  protected async showMore(): Promise<void> {
    const after = this.next();
    if (!after || this.isLoading()) return;
    this.isLoading.set(true);
    this.problem.set(null);
    const page = this.page();
    try {
      const more = await this.api.signalPage(page.key, this.params(), after);
      if (this.page() !== page) return; // a new report arrived meanwhile
      this.rows.update((rows) => [...rows, ...more.rows]);
      this.next.set(more.next);
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(`The next rows could not be read: ${error.lines().join('; ')}`);
    } finally {
      this.isLoading.set(false);
    }
  }
}
