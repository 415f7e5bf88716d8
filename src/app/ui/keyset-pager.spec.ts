import { KeysetPager } from './keyset-pager';

const page = (next: string | null, total: number | null = null, totalIsAtLeast = false, rows = 25) => ({
  items: Array.from({ length: rows }, (_, i) => i),
  size: 25,
  next,
  total,
  totalIsAtLeast,
});

describe('KeysetPager', () => {
  it('when pages are turned on and back, then each page starts at the cursor its predecessor gave', () => {
    const pager = new KeysetPager(25);
    pager.remember(page('c1', 80));
    pager.turn({ pageIndex: 1, pageSize: 25, previousPageIndex: 0, length: 80 });
    expect(pager.after()).toBe('c1');
    pager.remember(page('c2'));
    pager.turn({ pageIndex: 2, pageSize: 25, previousPageIndex: 1, length: 80 });
    expect(pager.after()).toBe('c2');
    pager.turn({ pageIndex: 1, pageSize: 25, previousPageIndex: 2, length: 80 });
    expect(pager.after()).toBe('c1');
    pager.turn({ pageIndex: 0, pageSize: 25, previousPageIndex: 1, length: 80 });
    expect(pager.after()).toBeUndefined();
  });

  it("when later pages carry no total, then the first page's count stays shown", () => {
    const pager = new KeysetPager(25);
    pager.remember(page('c1', 10_000, true));
    pager.turn({ pageIndex: 1, pageSize: 25, previousPageIndex: 0, length: 10_000 });
    pager.remember(page('c2'));
    expect(pager.totalLabel()).toBe('at least 10,000');
    expect(pager.totalOf('calc', 'calcs')).toBe('at least 10,000 calcs');
    expect(pager.length()).toBe(10_000);
  });

  it('when a lower bound is paged past, then the line beside the table grows with the rows read, as the paginator does', () => {
    const pager = new KeysetPager(25);
    pager.remember(page('c1', 26, true));
    expect([pager.totalOf('calc', 'calcs'), pager.length()]).toEqual(['at least 26 calcs', 26]);
    pager.turn({ pageIndex: 1, pageSize: 25, previousPageIndex: 0, length: 26 });
    pager.remember(page('c2'));
    expect([pager.totalOf('calc', 'calcs'), pager.length()]).toEqual(['at least 51 calcs', 51]);
    pager.turn({ pageIndex: 2, pageSize: 25, previousPageIndex: 1, length: 51 });
    pager.remember(page(null, null, false, 3));
    expect([pager.totalOf('calc', 'calcs'), pager.length()]).toEqual(['at least 53 calcs', 53]);
    // Back on the first page, what was read stays read.
    pager.turn({ pageIndex: 0, pageSize: 25, previousPageIndex: 2, length: 53 });
    pager.remember(page('c1'));
    expect(pager.totalLabel()).toBe('at least 53');
    // A search page that stopped early holds fewer rows and offers a next cursor: no row more is claimed for it.
    pager.reset();
    pager.remember(page('c1', 3, true, 3));
    expect(pager.totalLabel()).toBe('at least 3');
    // An exact count is never grown.
    pager.reset();
    pager.remember(page('c1', 30, false));
    pager.turn({ pageIndex: 1, pageSize: 25, previousPageIndex: 0, length: 30 });
    pager.remember(page(null, null, false, 5));
    expect(pager.totalLabel()).toBe('30');
  });

  it('when the server still offers a next page past the counted total, then the paginator can go on', () => {
    const pager = new KeysetPager(2);
    pager.remember(page('c1', 2, false, 2));
    expect(pager.length()).toBe(3);
  });

  it('when the only page is short or empty, then the paginator counts the rows it holds, not a full page', () => {
    const pager = new KeysetPager(25);
    pager.remember(page(null, 8, false, 8));
    expect(pager.length()).toBe(8);
    pager.reset();
    pager.remember(page(null, 0, false, 0));
    expect(pager.length()).toBe(0);
  });

  it('when exactly one row is counted, then the line beside the table names it in the singular', () => {
    const pager = new KeysetPager(25);
    expect(pager.totalOf('calc', 'calcs')).toBe('');
    pager.remember(page(null, 1, false, 1));
    expect(pager.totalOf('calc', 'calcs')).toBe('1 calc');
    pager.reset();
    pager.remember(page(null, 8, false, 8));
    expect(pager.totalOf('entry', 'entries')).toBe('8 entries');
  });

  it('when the last of several pages is short, then the length ends at its last row', () => {
    const pager = new KeysetPager(25);
    pager.remember(page('c1', null));
    pager.turn({ pageIndex: 1, pageSize: 25, previousPageIndex: 0, length: 26 });
    pager.remember(page(null, null, false, 3));
    expect(pager.length()).toBe(28);
  });

  it('when the page size changes, then paging starts again from the top and is counted again', () => {
    const pager = new KeysetPager(25);
    pager.remember(page('c1', 80));
    pager.turn({ pageIndex: 1, pageSize: 25, previousPageIndex: 0, length: 80 });
    pager.turn({ pageIndex: 1, pageSize: 50, previousPageIndex: 1, length: 80 });
    expect([pager.pageIndex(), pager.size(), pager.after(), pager.totalLabel()]).toEqual([0, 50, undefined, '']);
  });
});
