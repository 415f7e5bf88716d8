import type { HttpRequest } from '@angular/common/http';
import { provideRouter } from '@angular/router';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import { mountComponent, refusal } from '../../../../../test/support/client-harness';
import ProjectCalcs from './project-calcs';

const isProject = (r: HttpRequest<unknown>) => r.url === '/api/projects/7';
const isList = (r: HttpRequest<unknown>) => r.url === '/api/calcs' && r.params.get('projectId') === '7';
const emptyPage = { items: [], size: 25, next: null, total: 0, totalIsAtLeast: false, stoppedEarly: false };

async function open() {
  const reader = createAppAbility(defineRulesFor({ id: 1, roles: ['author'] }));
  return mountComponent(ProjectCalcs, {
    inputs: { id: 7 },
    providers: [provideRouter([]), { provide: PureAbility, useValue: reader }],
  });
}

describe("a project's calcs page", () => {
  it('when the project is not found, then the page says so and shows no search, table, count or pages', async () => {
    const d = await open();
    (await d.request(isProject)).flush(...refusal(404, 'Project not found'));
    // The calc list of an unknown project is simply empty; only the project's own read fails.
    (await d.request(isList)).flush(emptyPage);
    await d.settle();

    expect(d.text()).toContain('was not found');
    expect(d.text()).not.toMatch(/\b0 calcs\b/);
    expect(d.element.querySelector('table, input')).toBeNull();
    expect(await d.loader.getAllHarnesses(MatPaginatorHarness)).toHaveLength(0);
    d.http.verify();
  });

  it('when the search box is left for the next page after Enter, then the next page is read, not the first again', async () => {
    const d = await open();
    (await d.request(isProject)).flush({ id: 7, code: 'KF-0007', name: 'Fen pumps', status: 'active' });
    (await d.request(isList)).flush(emptyPage);
    await d.settle();
    const row = (n: number) => ({
      id: n,
      projectId: 7,
      projectCode: 'KF-0007',
      number: `C-${n}`,
      title: 'Mixer agitator shaft',
      partRef: 'DRG-1',
      projectArchived: false,
      latest: {
        id: n,
        label: 'A',
        status: 'draft',
        verdict: 'compliant',
        author: { id: 1, name: 'Ada Jessop' },
        ruleSet: { id: 3, code: 'KFD-ENG-014', version: 4 },
        updatedAt: '2026-12-05T12:00:00.000Z',
      },
    });
    const found = (from: number, rows: number, next: string | null, total: number | null) => ({
      ...emptyPage,
      items: Array.from({ length: rows }, (_, i) => row(from + i)),
      next,
      total,
      totalIsAtLeast: total !== null,
    });

    // Act: a search by Enter, then a click on "next page", which first takes the focus from the search box
    const box = d.element.querySelector('input') as HTMLInputElement;
    box.value = 'mixer agitator';
    box.dispatchEvent(new KeyboardEvent('keyup', { key: 'Enter' }));
    const first = await d.request((r) => isList(r) && r.params.get('q') === 'mixer agitator');
    expect(first.request.params.get('after')).toBeNull();
    first.flush(found(1, 25, 'c1', 26));
    await d.settle();
    box.dispatchEvent(new Event('blur'));
    await d.settle();
    // Leaving the box with the same words asks for nothing new.
    expect(d.http.match(isList)).toHaveLength(0);
    const paginator = await d.loader.getHarness(MatPaginatorHarness);
    const second = await d.answerDuring(() => paginator.goToNextPage(), isList, found(26, 25, 'c2', null));
    await d.settle();

    // Assert
    expect(second.params.get('after')).toBe('c1');
    expect(d.text()).toContain('C-26');
    expect(d.text()).not.toContain('C-1 ');
    expect(d.text()).toContain('26 – 50 of at least 51');
    expect(d.text()).toContain('at least 51 calcs');
    d.http.verify();
  });

  it('when the project has no calcs yet, then the count says 0 calcs beside the pages', async () => {
    const d = await open();
    (await d.request(isProject)).flush({ id: 7, code: 'KF-0007', name: 'Fen pumps', status: 'active' });
    (await d.request(isList)).flush(emptyPage);
    await d.settle();

    expect(d.text()).toContain('0 calcs');
    expect(await d.loader.getAllHarnesses(MatPaginatorHarness)).toHaveLength(1);
    d.http.verify();
  });
});
