import type { HttpRequest } from '@angular/common/http';
import { provideRouter } from '@angular/router';
import { TestKey } from '@angular/cdk/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../shared/authz/app-ability';
import { mountComponent } from '../../../../test/support/client-harness';
import { project } from '../../../../test/support/project-fixture';
import ProjectsPage from './projects-page';

const answer = (page: number, ids: number[], total: number) => ({ items: ids.map(project), total, page, size: 25 });
const ids = (from: number, count: number) => Array.from({ length: count }, (_, i) => from + i);
const isList = (page: number) => (r: HttpRequest<unknown>) =>
  r.url === '/api/projects' && r.params.get('page') === String(page);

async function open(first = answer(0, ids(1, 25), 240)) {
  const reader = createAppAbility(defineRulesFor({ id: 1, roles: ['author'] }));
  const d = await mountComponent(ProjectsPage, {
    providers: [provideRouter([]), { provide: PureAbility, useValue: reader }],
  });
  (await d.request(isList(0))).flush(first);
  await d.settle();
  return d;
}

describe('the projects page', () => {
  it('when a search is entered on page 3, then the list returns to page 1 and asks for the search', async () => {
    const d = await open();
    const paginator = await d.loader.getHarness(MatPaginatorHarness);
    for (const page of [1, 2])
      await d.answerDuring(() => paginator.goToNextPage(), isList(page), answer(page, ids(page * 25 + 1, 25), 240));
    expect(await paginator.getRangeLabel()).toBe('51 – 75 of 240');

    const field = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Find by code or name' }));
    const search = (await field.getControl(MatInputHarness))!;
    await search.setValue(' line 20');
    const enter = async () => (await search.host()).sendKeys(TestKey.ENTER);
    const sent = await d.answerDuring(enter, (r) => r.url === '/api/projects', answer(0, [20, 200], 2));

    expect([sent.params.get('q'), sent.params.get('page')]).toEqual(['line 20', '0']);
    expect(await paginator.getRangeLabel()).toBe('1 – 2 of 2');
    expect(d.text()).toContain('KF-0200');
    d.http.verify();
  });

  it('given no projects at all, then the empty list says none exist yet; after a search, that none match', async () => {
    const d = await open(answer(0, [], 0));
    expect(d.text()).toContain('No projects yet');
    expect(d.text()).not.toContain('No projects match');

    const field = await d.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Find by code or name' }));
    const search = (await field.getControl(MatInputHarness))!;
    await search.setValue('zzz');
    const enter = async () => (await search.host()).sendKeys(TestKey.ENTER);
    await d.answerDuring(enter, (r) => r.url === '/api/projects', answer(0, [], 0));
    expect(d.text()).toContain('No projects match');
    d.http.verify();
  });
});
