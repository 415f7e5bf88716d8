import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { RevisionSummary } from '../../../../../shared/schemas/calc-dto';
import { assertApiFailure } from '../../../core/http/api-failure';
import { CalcsApi } from '../calcs-api';

/** The diff between any two revisions of a calc: inputs and checklist outcomes. */
@Component({
  selector: 'tt-revision-history',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatSelectModule],
  template: `
    <div class="pick">
      <mat-form-field
        ><mat-label>From</mat-label>
        <mat-select [(ngModel)]="from">
          @for (r of revisions(); track r.id) {
            <mat-option [value]="r.id">rev {{ r.label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field
        ><mat-label>To</mat-label>
        <mat-select [(ngModel)]="to">
          @for (r of revisions(); track r.id) {
            <mat-option [value]="r.id">rev {{ r.label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <button mat-stroked-button (click)="compare()" [disabled]="!from || !to">Compare</button>
    </div>
    @if (problem(); as p) {
      <p class="problem" role="alert">{{ p }}</p>
    }
    @if (diff(); as d) {
      <h3>Inputs</h3>
      <pre class="diff">{{ d.input ?? 'No differences in the inputs.' }}</pre>
      <h3>Checklist outcomes</h3>
      <pre class="diff">{{ d.checklist ?? 'No differences in the checklist outcomes.' }}</pre>
    }
  `,
  styles: `
    .pick {
      display: flex;
      gap: 12px;
      align-items: center;
      flex-wrap: wrap;
    }
    .diff {
      background: #f3efe6;
      padding: 10px;
      border-radius: 4px;
      font-family: var(--tt-mono);
      font-size: 12px;
      overflow-x: auto;
      white-space: pre;
    }
    h3 {
      font: var(--mat-sys-title-small);
      margin: 14px 0 6px;
    }
    .problem {
      color: var(--tt-fail);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionHistory {
  private readonly api = inject(CalcsApi);
  readonly calcId = input.required<number>();
  readonly revisions = input.required<RevisionSummary[]>();
  readonly selectedId = input.required<number>();
  protected from = 0;
  protected to = 0;
  protected readonly diff = signal<{ input: string | null; checklist: string | null } | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected async compare(): Promise<void> {
    try {
      this.diff.set(await this.api.diff(this.calcId(), this.from, this.to));
      this.problem.set(null);
    } catch (error) {
      assertApiFailure(error);
      this.problem.set(error.message);
    }
  }
}
