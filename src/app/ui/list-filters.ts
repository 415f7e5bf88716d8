import { computed, signal, type Signal, type WritableSignal } from '@angular/core';
import type { PageEvent } from '@angular/material/paginator';

/**
 * The filters of a server-paged list, in one signal its resource reads. Changing a filter first sends the list back
 * to its first page (`toFirstPage`): a page number or cursor kept from the old filter would name rows of another
 * list. Every filtered list filters this way: the audit trail (by cursor) directly, the page-numbered lists (sent
 * mail, people, projects) through `pagedFilters`.
 */
export class ListFilters<F extends object> {
  readonly #value: WritableSignal<F>;
  readonly value: Signal<F>;

  constructor(
    initial: F,
    private readonly toFirstPage: () => void,
  ) {
    this.#value = signal(initial);
    this.value = this.#value.asReadonly();
  }

  /**
   * Sets the filters named in `patch`; the others keep theirs. A patch that changes nothing (a search box left
   * without a new word, say) keeps the page too.
   */
  set(patch: Partial<F>): void {
    const current = this.#value();
    if (Object.entries(patch).every(([key, value]) => Object.is(current[key as keyof F], value))) return;
    this.toFirstPage();
    this.#value.set({ ...current, ...patch });
  }
}

/**
 * A page-numbered list's filters and page together: `params` (page, size and filters) is what its resource reads,
 * `turn` follows the paginator, and a filter change returns to page 0 (keeping the page size).
 */
export function pagedFilters<F extends object>(initial: F, size = 25) {
  const paging = signal({ page: 0, size });
  const filters = new ListFilters(initial, () => paging.update((p) => ({ ...p, page: 0 })));
  return {
    filters,
    params: computed(() => ({ ...paging(), ...filters.value() })),
    turn: (event: PageEvent) => paging.set({ page: event.pageIndex, size: event.pageSize }),
  };
}
