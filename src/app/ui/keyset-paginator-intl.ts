import { Injectable, effect, inject } from '@angular/core';
import { MatPaginatorIntl } from '@angular/material/paginator';
import { KeysetPager } from './keyset-pager';

/**
 * The paginator's range label for a list counted only up to a cap: "1 – 25 of at least 1,000" while the count is a
 * lower bound, so the label never gives a capped count as the list's size; otherwise Material's own words. Provide it
 * on the component that shows the list (`providers: [KEYSET_PAGINATOR_INTL]`) and make its pager with `keysetPager`.
 */
@Injectable()
export class KeysetPaginatorIntl extends MatPaginatorIntl {
  private pager: KeysetPager | null = null;

  constructor() {
    super();
    const plain = this.getRangeLabel;
    this.getRangeLabel = (page, pageSize, length) => {
      const label = plain(page, pageSize, length);
      if (!this.pager?.isAtLeast()) return label;
      return label.replace(/ of (\d+)$/, (_, n: string) => ` of at least ${Number(n).toLocaleString('en-US')}`);
    };
  }

  /** Shows this pager's counts; the label is drawn again whenever the count turns from a bound to exact, or back. */
  follow(pager: KeysetPager): void {
    this.pager = pager;
    effect(() => {
      pager.isAtLeast();
      this.changes.next();
    });
  }
}

export const KEYSET_PAGINATOR_INTL = { provide: MatPaginatorIntl, useClass: KeysetPaginatorIntl };

/** A keyset pager whose paginator says "of at least" for a capped count; call it where the component is made. */
export function keysetPager(size: number): KeysetPager {
  const intl = inject(MatPaginatorIntl);
  if (!(intl instanceof KeysetPaginatorIntl)) throw new Error('keysetPager needs providers: [KEYSET_PAGINATOR_INTL]');
  const pager = new KeysetPager(size);
  intl.follow(pager);
  return pager;
}
