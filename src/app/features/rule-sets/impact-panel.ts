import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { ImpactReport } from '../../../../shared/schemas/rule-set.schema';
import { assertApiFailure } from '../../core/http/api-failure';
import { VerdictBadge } from '../../ui/verdict-badge';
import { RuleSetsApi } from './rule-sets-api';

/** Which approved calcs would change verdict under this version, and the clauses behind each change. */
@Component({
  selector: 'tt-impact-panel',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, VerdictBadge],
  template: `
    <div class="row">
      <button mat-flat-button (click)="run()" [disabled]="isRunning()">
        <mat-icon>manage_search</mat-icon> Re-evaluate every approved calc
      </button>
      <a mat-stroked-button [href]="'/api/rule-sets/' + ruleSetId() + '/impact.csv'" download
        ><mat-icon>download</mat-icon> CSV</a
      >
    </div>
    @if (isRunning()) {
      <mat-progress-bar mode="indeterminate" aria-label="Evaluating" />
    }
    @if (problem(); as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
    @if (report(); as r) {
      <p>
        <strong>{{ r.changed }}</strong> of {{ r.evaluated }} approved revisions change under {{ r.ruleSet.code }} v{{
          r.ruleSet.version
        }}
        (evaluated in {{ r.elapsedMs }} ms).
      </p>
      <table class="impact">
        <thead>
          <tr>
            <th>Calc</th>
            <th>Now</th>
            <th>Under this version</th>
            <th>Clauses that change</th>
          </tr>
        </thead>
        <tbody>
          @for (row of r.rows; track row.revisionId) {
            <tr>
              <td>
                <a [routerLink]="['/calcs', row.calcId]" [queryParams]="{ rev: row.revisionId }" class="tt-mono"
                  >{{ row.projectCode }} {{ row.number }} rev {{ row.revision }}</a
                >
                <div class="tt-muted small">{{ row.title }}</div>
              </td>
              <td><tt-verdict-badge [verdict]="row.before" /></td>
              <td><tt-verdict-badge [verdict]="row.after" /></td>
              <td>
                <ul>
                  @for (c of row.clauses; track c.clauseId + c.location) {
                    <li>
                      <span class="tt-mono">§{{ c.clauseId }}</span> {{ c.title }}, {{ c.location }}: {{ c.before }} →
                      {{ c.after }}
                    </li>
                  }
                </ul>
              </td>
            </tr>
          } @empty {
            <tr>
              <td colspan="4" class="tt-muted">No approved calc changes verdict.</td>
            </tr>
          }
        </tbody>
      </table>
    }
  `,
  styles: `
    .row {
      display: flex;
      gap: 10px;
      margin-bottom: 10px;
    }
    .impact {
      width: 100%;
      border-collapse: collapse;
      font-size: 13px;
      th,
      td {
        text-align: left;
        padding: 6px 8px;
        border-bottom: 1px solid var(--tt-rule);
        vertical-align: top;
      }
      ul {
        margin: 0;
        padding-left: 16px;
      }
    }
    .small {
      font-size: 12px;
    }
    .problem {
      color: var(--tt-fail);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImpactPanel {
  private readonly api = inject(RuleSetsApi);
  readonly ruleSetId = input.required<number>();
  protected readonly report = signal<ImpactReport | null>(null);
  protected readonly isRunning = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected async run(): Promise<void> {
    this.isRunning.set(true);
    this.problem.set(null);
    try {
      this.report.set(await this.api.impact(this.ruleSetId()));
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.message);
    } finally {
      this.isRunning.set(false);
    }
  }
}
