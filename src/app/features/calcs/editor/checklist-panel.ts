import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { ChecklistTable } from '../checklist/checklist-table';
import type { ChecklistState } from './live-calc';
import { placeOf } from './issue-map';

/** The live checklist against the revision's design standard, with its verdict and method issues. */
@Component({
  selector: 'tt-checklist-panel',
  imports: [ChecklistTable, MatSlideToggleModule],
  template: `
    @let s = state();
    @switch (s.kind) {
      @case ('ready') {
        @let c = s.checklist;
        <div class="verdict" [attr.data-verdict]="c.verdict">
          <strong
            >{{ c.verdict === 'compliant' ? 'Meets' : 'Does not meet' }} {{ c.ruleSet.code }} v{{
              c.ruleSet.version
            }}</strong
          >
          <span class="tt-mono"
            >{{ c.counts.pass }} pass · {{ c.counts.mandatoryFail }} mandatory fail · {{ c.counts.error }} error ·
            {{ c.counts.notApplicable }} n/a</span
          >
          @if (c.counts.advisoryFail) {
            <span class="advisory">{{ c.counts.advisoryFail }} advisory not met</span>
          }
        </div>
        <!-- Reasons are texts with counts in them: an edit rewrites them, so their place is their key. -->
        @for (r of c.verdictReasons; track $index) {
          <p class="reason">{{ r }}</p>
        }
        @for (m of c.methodIssues; track m.path) {
          <p class="reason">{{ place(m.path) }}: {{ m.message }}</p>
        }
        <mat-slide-toggle [checked]="showAll()" (change)="showAll.set($event.checked)"
          >Show clauses that do not apply</mat-slide-toggle
        >
        <tt-checklist-table [checklist]="c" [showNotApplicable]="showAll()" />
        @if (c.manual.length) {
          <p class="tt-muted small">{{ c.manual.length }} manual items are ticked by the checker on the calc page.</p>
        }
      }
      @case ('failed') {
        <p class="reason" role="alert">{{ s.message }}</p>
      }
      @case ('none') {
        <p class="tt-muted">{{ emptyText() }}</p>
      }
    }
  `,
  styleUrl: './results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChecklistPanel {
  readonly state = input.required<ChecklistState>();
  /** Why there is no checklist (standard not loaded, or no valid input yet). */
  readonly problem = input<string | null>(null);
  protected readonly showAll = signal(false);
  protected readonly place = placeOf;
  protected readonly emptyText = computed(
    () => this.problem() ?? 'The checklist appears once the input is complete and valid.',
  );
}
