import type { PageEvent } from '@angular/material/paginator';
import { ListFilters, pagedFilters } from './list-filters';

describe('ListFilters', () => {
  it('when a filter changes, then the list goes back to its first page and the other filters stay', () => {
    const steps: string[] = [];
    const filters = new ListFilters({ status: '', q: 'shaft' }, () =>
      steps.push(`first page, status '${filters.value().status}'`),
    );

    filters.set({ status: 'failed' });

    expect(steps).toEqual(["first page, status ''"]);
    expect(filters.value()).toEqual({ status: 'failed', q: 'shaft' });
  });

  it('when a page-numbered list is turned and then filtered, then it is on page 0 with the size kept', () => {
    const list = pagedFilters({ q: '' });
    list.turn({ pageIndex: 3, pageSize: 50 } as PageEvent);
    expect(list.params()).toEqual({ page: 3, size: 50, q: '' });

    list.filters.set({ q: 'KF-02' });

    expect(list.params()).toEqual({ page: 0, size: 50, q: 'KF-02' });
  });

  it('when a filter is set to the value it has (a search box left unchanged), then the page stays', () => {
    const list = pagedFilters({ q: 'KF-02', status: '' });
    list.turn({ pageIndex: 2, pageSize: 25 } as PageEvent);

    list.filters.set({ q: 'KF-02' });

    expect(list.params()).toEqual({ page: 2, size: 25, q: 'KF-02', status: '' });
  });
});
