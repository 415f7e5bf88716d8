import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { assertApiFailure } from '../../core/http/api-failure';
import { LoadFailure } from '../../ui/load-failure';
import { ChecklistTable } from '../calcs/checklist/checklist-table';
import { VerdictBadge } from '../../ui/verdict-badge';
import { CalcsApi } from '../calcs/calcs-api';
import { RuleSetsApi, type TryItResponse } from './rule-sets-api';

/** Evaluates this version against any calc's latest revision, storing nothing. */
@Component({
  selector: 'tt-try-it-panel',
  imports: [
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatSelectModule,
    ChecklistTable,
    VerdictBadge,
    LoadFailure,
  ],
  template: `
    <div class="row">
      <mat-form-field class="pick"
        ><mat-label>Calc to try it on</mat-label>
        <mat-select [ngModel]="revisionId()" (ngModelChange)="revisionId.set($event)">
          @for (c of calcOptions(); track c.id) {
            <mat-option [value]="c.latest.id"
              >{{ c.projectCode }} {{ c.number }} rev {{ c.latest.label }} — {{ c.title }}</mat-option
            >
          }
        </mat-select>
      </mat-form-field>
      <button mat-flat-button (click)="run()" [disabled]="!revisionId()">Evaluate</button>
    </div>
    @if (calcs.error(); as error) {
      <tt-load-failure [error]="error" what="list of calcs" (retry)="calcs.reload()" />
    }
    @if (problem(); as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
    @if (outcome(); as o) {
      <p class="verdicts">
        Under its own standard: <tt-verdict-badge [verdict]="o.before?.verdict ?? null" /> · under
        {{ o.ruleSet.code }} v{{ o.ruleSet.version }}: <tt-verdict-badge [verdict]="o.checklist.verdict" />
      </p>
      <tt-checklist-table [checklist]="o.checklist" />
    }
  `,
  styles:
    '.row { display: flex; gap: 12px; align-items: center; } .pick { width: 520px; } .problem { color: var(--tt-fail); } .verdicts { display: flex; gap: 8px; align-items: center; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TryItPanel {
  private readonly api = inject(RuleSetsApi);
  readonly ruleSetId = input.required<number>();
  protected readonly calcs = inject(CalcsApi).list(
    computed(() => ({ q: '', size: 200, sort: 'number', dir: 'asc' as const })),
  );
  protected readonly calcOptions = computed(() => (this.calcs.hasValue() ? this.calcs.value().items : []));
  protected readonly revisionId = signal<number | null>(null);
  protected readonly outcome = signal<TryItResponse | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected async run(): Promise<void> {
    this.problem.set(null);
    try {
      this.outcome.set(await this.api.tryIt(this.ruleSetId(), this.revisionId()!));
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.message);
    }
  }
}
