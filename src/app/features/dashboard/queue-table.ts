import { ChangeDetectionStrategy, Component, computed, effect, inject, input } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import type { QueueDto, QueueItem } from '../../../../shared/schemas/queue.schema';
import { StateBadge } from '../../ui/state-badge';
import { VerdictBadge } from '../../ui/verdict-badge';
import { KEYSET_PAGINATOR_INTL, keysetPager } from '../../ui/keyset-paginator-intl';
import { LoadFailure } from '../../ui/load-failure';
import { CalcsApi, QUEUE_PAGE } from '../calcs/calcs-api';

/** One queue of waiting calcs, oldest first, paged on the server (its first page comes with the overview). */
@Component({
  selector: 'tt-queue-table',
  imports: [DatePipe, RouterLink, MatTableModule, MatPaginatorModule, StateBadge, VerdictBadge, LoadFailure],
  template: `
    <table mat-table [dataSource]="rows()" [attr.aria-label]="queue().label">
      <ng-container matColumnDef="number">
        <th mat-header-cell *matHeaderCellDef>Calc</th>
        <td mat-cell *matCellDef="let i">
          <a [routerLink]="['/calcs', i.calcId]" [queryParams]="{ rev: i.revisionId }" class="tt-mono"
            >{{ i.projectCode }} {{ i.number }}</a
          >
        </td>
      </ng-container>
      <ng-container matColumnDef="title">
        <th mat-header-cell *matHeaderCellDef>Title</th>
        <td mat-cell *matCellDef="let i">
          {{ i.title }} <span class="tt-muted">rev {{ i.revision }}</span>
        </td>
      </ng-container>
      <ng-container matColumnDef="status">
        <th mat-header-cell *matHeaderCellDef>State</th>
        <td mat-cell *matCellDef="let i"><tt-state-badge [state]="i.status" /></td>
      </ng-container>
      <ng-container matColumnDef="verdict">
        <th mat-header-cell *matHeaderCellDef>Standard</th>
        <td mat-cell *matCellDef="let i"><tt-verdict-badge [verdict]="i.verdict" /></td>
      </ng-container>
      <ng-container matColumnDef="authorName">
        <th mat-header-cell *matHeaderCellDef>Author</th>
        <td mat-cell *matCellDef="let i">{{ i.authorName }}</td>
      </ng-container>
      <ng-container matColumnDef="since">
        <th mat-header-cell *matHeaderCellDef>Waiting since</th>
        <td mat-cell *matCellDef="let i">
          {{ i.since | date: 'd MMM, HH:mm' }} <span class="tt-muted">({{ ageOf(i) }})</span>
        </td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let row; columns: columns"></tr>
    </table>
    @if (laterError(); as error) {
      <tt-load-failure [error]="error" what="page of this queue" (retry)="reloadPage()" />
    }
    @if (pager.length() > firstPage) {
      <mat-paginator
        [length]="pager.length()"
        [pageIndex]="pager.pageIndex()"
        [pageSize]="pager.size()"
        [pageSizeOptions]="[5, 10, 25]"
        (page)="turn($event)"
        [attr.aria-label]="queue().label + ' pages'"
      />
    }
  `,
  styles: 'table { width: 100%; background: transparent; } a { font-weight: 700; }',
  providers: [KEYSET_PAGINATOR_INTL],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QueueTable {
  readonly queue = input.required<QueueDto>();
  protected readonly firstPage = QUEUE_PAGE;
  protected readonly pager = keysetPager(QUEUE_PAGE);
  protected readonly columns = ['number', 'title', 'status', 'verdict', 'authorName', 'since'];
  // Later pages (or another page size) are read on their own; the overview's copy is page one.
  private readonly isFirstPage = computed(() => this.pager.pageIndex() === 0 && this.pager.size() === QUEUE_PAGE);
  private readonly later = inject(CalcsApi).queuePage(
    computed(() => this.queue().key),
    computed(() => (this.isFirstPage() ? undefined : { size: this.pager.size(), after: this.pager.after() })),
  );
  private readonly page = computed(() =>
    this.isFirstPage() ? this.queue() : this.later.hasValue() ? this.later.value() : null,
  );
  protected readonly rows = computed(() => this.page()?.items ?? []);
  protected readonly laterError = computed(() => (this.isFirstPage() ? undefined : this.later.error()));
  private readonly now = computed(() => (this.queue(), Date.now()));

  constructor() {
    effect(() => {
      const page = this.page();
      if (page) this.pager.remember(page);
    });
  }

  protected reloadPage(): void {
    this.later.reload();
  }

  protected turn(event: PageEvent): void {
    this.pager.turn(event);
  }

  protected ageOf(item: QueueItem): string {
    const hours = (this.now() - Date.parse(item.since)) / 3_600_000;
    return hours < 1 ? 'under an hour' : hours < 48 ? `${Math.floor(hours)} h` : `${Math.floor(hours / 24)} days`;
  }
}
