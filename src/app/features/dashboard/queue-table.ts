import { ChangeDetectionStrategy, Component, computed, effect, input, viewChild } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import type { QueueDto, QueueItem } from '../../../../shared/schemas/queue.schema';
import { StateBadge } from '../../ui/state-badge';
import { VerdictBadge } from '../../ui/verdict-badge';

/** One queue of waiting calcs: sortable and paged in the browser (queues are short by nature). */
@Component({
  selector: 'tt-queue-table',
  imports: [DatePipe, RouterLink, MatTableModule, MatSortModule, MatPaginatorModule, StateBadge, VerdictBadge],
  template: `
    <table mat-table [dataSource]="dataSource" matSort matSortActive="since" matSortDirection="asc" [attr.aria-label]="queue().label">
      <ng-container matColumnDef="number">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Calc</th>
        <td mat-cell *matCellDef="let i"><a [routerLink]="['/calcs', i.calcId]" [queryParams]="{ rev: i.revisionId }" class="tt-mono">{{ i.projectCode }} {{ i.number }}</a></td>
      </ng-container>
      <ng-container matColumnDef="title">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Title</th>
        <td mat-cell *matCellDef="let i">{{ i.title }} <span class="tt-muted">rev {{ i.revision }}</span></td>
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
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Author</th>
        <td mat-cell *matCellDef="let i">{{ i.authorName }}</td>
      </ng-container>
      <ng-container matColumnDef="since">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Waiting since</th>
        <td mat-cell *matCellDef="let i">{{ i.since | date: 'd MMM, HH:mm' }} <span class="tt-muted">({{ ageOf(i) }})</span></td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let row; columns: columns"></tr>
    </table>
    @if (queue().items.length > 5) { <mat-paginator [pageSize]="5" [pageSizeOptions]="[5, 10, 25]" [attr.aria-label]="queue().label + ' pages'" /> }
  `,
  styles: 'table { width: 100%; background: transparent; } a { font-weight: 700; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QueueTable {
  readonly queue = input.required<QueueDto>();
  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);
  protected readonly dataSource = new MatTableDataSource<QueueItem>([]);
  protected readonly columns = ['number', 'title', 'status', 'verdict', 'authorName', 'since'];
  private readonly now = computed(() => (this.queue(), Date.now()));

  constructor() {
    this.dataSource.sortingDataAccessor = (item, key) => (key === 'number' ? `${item.projectCode} ${item.number}` : String(item[key as keyof QueueItem] ?? ''));
    effect(() => {
      this.dataSource.data = this.queue().items;
      this.dataSource.sort = this.sort() ?? null;
      this.dataSource.paginator = this.paginator() ?? null;
    });
  }

  protected ageOf(item: QueueItem): string {
    const hours = (this.now() - Date.parse(item.since)) / 3_600_000;
    return hours < 1 ? 'under an hour' : hours < 48 ? `${Math.floor(hours)} h` : `${Math.floor(hours / 24)} days`;
  }
}
