import { signal, type Signal, type WritableSignal } from '@angular/core';

/**
 * The filters of a server-paged list, in one signal its resource reads. Changing a filter first sends the list back
 * to its first page (`toFirstPage`): a page number or cursor kept from the old filter would name rows of another
 * list. The audit trail and the sent-mail outbox filter this way.
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

  /** Sets the filters named in `patch`; the others keep theirs. */
  set(patch: Partial<F>): void {
    this.toFirstPage();
    this.#value.update((filters) => ({ ...filters, ...patch }));
  }
}
