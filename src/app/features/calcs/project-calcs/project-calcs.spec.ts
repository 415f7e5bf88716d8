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
