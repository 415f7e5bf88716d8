import { computed, signal, untracked, type WritableSignal } from '@angular/core';
import type { PageEvent } from '@angular/material/paginator';
import type { KeysetPage } from '../../../shared/schemas/common.schema';

/**
 * Paging state of a server list read by keyset: the cursor that starts each page seen so far
 * (so "previous" goes back without offsets), and the total the server counted on the first page
 * of the current filter (later pages do not count again). A mat-paginator shows it with
 * `[length]="pager.length()"`, `[pageIndex]="pager.pageIndex()"` and no first/last buttons.
 */
export class KeysetPager {
  readonly pageIndex = signal(0);
  readonly size: WritableSignal<number>;
  /** The `after` parameter of the page being shown; a resource reads it as one of its params. */
  readonly after = signal<string | undefined>(undefined);
  private readonly total = signal<{ total: number; isAtLeast: boolean } | null>(null);
  private readonly next = signal<string | null>(null);
  /** Rows on the page shown; a page being fetched counts as full (every page before the last is). */
  private readonly rows = signal(0);
  /** Rows each page read so far held (a search's page that stopped early may hold fewer than a page). */
  private readonly pageRows = signal<number[]>([]);
  private cursors: (string | undefined)[] = [undefined];

  constructor(size: number) {
    this.size = signal(size);
  }

  /**
   * Paginator length: the counted total, extended by the rows seen so far and by one while the server still offers
   * a next page. A short page counts its own rows: 8 entries read "1 – 8 of 8", never "1 – 25 of 25".
   */
  readonly length = computed(() => {
    const seen = this.pageIndex() * this.size() + this.rows() + (this.next() ? 1 : 0);
    return Math.max(this.total()?.total ?? 0, seen);
  });

  /**
   * "1,234" or "at least 1,000", for a line beside the table. "At least": a capped count knows
   * there are more than its cap, and a search counted over a bounded walk knows only a lower bound.
   */
  readonly totalLabel = computed(() => {
    const t = this.total();
    return t ? `${t.isAtLeast ? 'at least ' : ''}${this.atLeast(t).toLocaleString('en-US')}` : '';
  });

  /**
   * A lower bound grows with the rows read since it was counted on the first page, and by one while a full page is
   * followed by another, as the paginator's length: a search that counted "at least 26" on its first page of 25 reads
   * "at least 51" on its second, where the paginator shows "26 – 50 of at least 51". An exact count stays as counted.
   */
  private atLeast(t: { total: number; isAtLeast: boolean }): number {
    if (!t.isAtLeast) return t.total;
    const rows = this.pageRows();
    const read = rows.reduce((sum, n) => sum + (n ?? 0), 0);
    // One more only past the last page read, whose rows are not counted yet.
    const unread = rows[this.pageIndex() + 1] === undefined;
    const more = this.next() && unread && this.rows() === this.size() ? 1 : 0;
    return Math.max(t.total, read + more);
  }

  /** Whether the count is only a lower bound (a capped count, or a search's bounded walk). */
  readonly isAtLeast = computed(() => this.total()?.isAtLeast ?? false);

  /** The count with its noun: "1 calc", "8 calcs", "at least 1,000 calcs"; empty until a count is known. */
  totalOf(one: string, many: string): string {
    const t = this.total();
    return t ? `${this.totalLabel()} ${t.total === 1 && !t.isAtLeast ? one : many}` : '';
  }

  /** Called (from an effect) with every page the resource returns; reads no signal the effect should follow. */
  remember(page: KeysetPage<unknown>): void {
    untracked(() => {
      if (page.total !== null) this.total.set({ total: page.total, isAtLeast: page.totalIsAtLeast });
      this.next.set(page.next);
      this.rows.set(page.items.length);
      const index = this.pageIndex();
      this.pageRows.update((rows) => Object.assign([...rows], { [index]: page.items.length }));
      this.cursors[index + 1] = page.next ?? undefined;
    });
  }

  /** A new filter, sort or page size: back to the first page, to be counted again. */
  reset(size = this.size()): void {
    this.size.set(size);
    this.cursors = [undefined];
    this.total.set(null);
    this.next.set(null);
    this.rows.set(0);
    this.pageRows.set([]);
    this.pageIndex.set(0);
    this.after.set(undefined);
  }

  /** The paginator moved one page on or back (or changed its size). */
  turn(event: PageEvent): void {
    if (event.pageSize !== this.size()) return this.reset(event.pageSize);
    this.pageIndex.set(event.pageIndex);
    this.rows.set(this.size());
    this.after.set(this.cursors[event.pageIndex]);
  }
}
