import { ListFilters } from './list-filters';

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
});
