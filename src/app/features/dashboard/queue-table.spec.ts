import { provideRouter } from '@angular/router';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { QueueDto, QueueItem } from '../../../../shared/schemas/queue.schema';
import { mountComponent } from '../../../../test/support/client-harness';
import { QueueTable } from './queue-table';

function item(n: number): QueueItem {
  return {
    calcId: n,
    revisionId: 100 + n,
    projectCode: 'KFD-SP450',
    number: `CV-${n}`,
    title: `Shaft ${n}`,
    revision: 'A',
    status: 'in_check',
    verdict: 'compliant',
    authorName: 'Morwenna Hale',
    since: new Date(Date.now() - n * 3_600_000 * 30).toISOString(),
  } as QueueItem;
}
function queue(items: QueueItem[], over: Partial<QueueDto> = {}): QueueDto {
  return {
    key: 'to-check',
    label: 'Waiting for my check',
    items,
    next: null,
    total: items.length,
    totalIsAtLeast: false,
    ...over,
  } as QueueDto;
}

async function mount(q: QueueDto) {
  const d = await mountComponent(QueueTable, { inputs: { queue: q }, providers: [provideRouter([])] });
  const cells = async () => (await d.loader.getHarness(MatTableHarness)).getCellTextByColumnName();
  return { ...d, cells };
}

describe('a dashboard queue', () => {
  it('when the queue fits one page, then its rows show oldest first with their age and no pager', async () => {
    const d = await mount(queue([item(3), item(1)]));
    const cells = await d.cells();
    expect(cells['number'].text).toEqual(['KFD-SP450 CV-3', 'KFD-SP450 CV-1']);
    expect(cells['since'].text[0]).toMatch(/\(3 days\)$/);
    expect(cells['since'].text[1]).toMatch(/\(30 h\)$/);
    expect(await d.loader.getAllHarnesses(MatPaginatorHarness)).toEqual([]);
    d.http.verify();
  });

  it('when the queue was counted only up to its cap, then the pager says "of at least", never the cap as the size', async () => {
    const d = await mount(queue([1, 2, 3, 4, 5].map(item), { next: 'cursor-5', total: 1000, totalIsAtLeast: true }));
    const pager = await d.loader.getHarness(MatPaginatorHarness);
    expect(await pager.getRangeLabel()).toBe('1 – 5 of at least 1,000');
    d.http.verify();
  });

  it('when the queue is longer than a page, then the next page is read by its cursor and shown, and going back needs no request', async () => {
    const d = await mount(queue([1, 2, 3, 4, 5].map(item), { next: 'cursor-5', total: 7 }));
    const pager = await d.loader.getHarness(MatPaginatorHarness);
    expect(await pager.getRangeLabel()).toBe('1 – 5 of 7');
    // The next page is read through a resource, whose open request holds the harness's stability wait until answered.
    const turning = pager.goToNextPage();
    await d.settle();
    const req = d.http.expectOne((r) => r.url === '/api/dashboard/queues/to-check');
    expect(req.request.params.get('after')).toBe('cursor-5');
    expect(req.request.params.get('size')).toBe('5');
    req.flush(queue([item(6), item(7)], { total: null }));
    await turning;
    await d.settle();
    expect((await d.cells())['number'].text).toEqual(['KFD-SP450 CV-6', 'KFD-SP450 CV-7']);

    await pager.goToPreviousPage();
    await d.settle();
    expect((await d.cells())['number'].text[0]).toBe('KFD-SP450 CV-1');
    d.http.verify();
  });
});
