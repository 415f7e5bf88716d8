import type { HttpRequest } from '@angular/common/http';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import type { UserDto } from '../../../../../shared/schemas/user.schema';
import { mountComponent } from '../../../../../test/support/client-harness';
import UsersPage from './users-page';

const person = (id: number): UserDto => ({
  id,
  username: `person${id}`,
  displayName: `Kestrel Fen person ${id}`,
  email: `person${id}@kestrelfen.example`,
  roles: ['author'],
  pendingRoles: [],
  active: true,
  secondFactorRequired: false,
  lastSignInAt: null,
  createdAt: '2026-11-02T08:00:00Z',
  version: 1,
});
const answer = (page: number, ids: number[], total: number) => ({ items: ids.map(person), total, page, size: 25 });
const ids = (from: number, count: number) => Array.from({ length: count }, (_, i) => from + i);
const isList = (page: number) => (r: HttpRequest<unknown>) =>
  r.url === '/api/users' && r.params.get('page') === String(page);

async function open() {
  const admin = createAppAbility(defineRulesFor({ id: 1, roles: ['admin'] }));
  const d = await mountComponent(UsersPage, { providers: [{ provide: PureAbility, useValue: admin }] });
  d.http.expectOne('/api/role-grants').flush([]);
  (await d.request(isList(0))).flush(answer(0, ids(1, 25), 60));
  await d.settle();
  return d;
}

describe('the people and roles page', () => {
  it('when a search is made on page 2, then the list returns to the first page and asks for the search', async () => {
    const d = await open();
    const paginator = await d.loader.getHarness(MatPaginatorHarness);
    await d.answerDuring(() => paginator.goToNextPage(), isList(1), answer(1, ids(26, 25), 60));
    expect(await paginator.getRangeLabel()).toBe('26 – 50 of 60');

    const field = await d.loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: 'Find by username or name' }),
    );
    const search = (await field.getControl(MatInputHarness))!;
    await search.setValue('  person2 ');
    const isSearch = (r: HttpRequest<unknown>) => r.url === '/api/users';
    const sent = await d.answerDuring(() => search.blur(), isSearch, answer(0, [2, 20], 2));

    expect([sent.params.get('q'), sent.params.get('page')]).toEqual(['person2', '0']);
    expect(await paginator.getRangeLabel()).toBe('1 – 2 of 2');
    expect(d.text()).toContain('Kestrel Fen person 20');
    d.http.verify();
  });
});
