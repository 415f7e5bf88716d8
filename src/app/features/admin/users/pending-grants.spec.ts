import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import type { RoleGrantDto } from '../../../../../shared/schemas/role-grant.schema';
import { PendingGrants } from './pending-grants';

const ME = 5;
const grant = (id: number, over: Partial<RoleGrantDto> = {}): RoleGrantDto => ({
  id,
  user: { id: 20 + id, name: `Person ${id}`, username: `person${id}` },
  role: 'approver',
  status: 'pending',
  requestedBy: { id: 9, name: 'Other Admin' },
  requestedAt: '2026-12-01T10:00:00Z',
  decidedBy: null,
  decidedAt: null,
  ...over,
});
const MINE = grant(2, { role: 'checker', requestedBy: { id: ME, name: 'Me' } });

let fixture: ComponentFixture<PendingGrants>;
let http: HttpTestingController;
const el = () => fixture.nativeElement as HTMLElement;
const button = (text: string, within: Element = el()) =>
  [...within.querySelectorAll<HTMLButtonElement>('button')].find((b) => b.textContent?.trim().startsWith(text));

async function tick(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
}

async function turn(): Promise<void> {
  await tick();
  fixture.detectChanges();
  await fixture.whenStable();
}

function type(input: HTMLInputElement, value: string): void {
  input.value = value;
  input.dispatchEvent(new Event('input'));
}

beforeEach(async () => {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      { provide: PureAbility, useValue: createAppAbility(defineRulesFor({ id: ME, roles: ['admin'] })) },
    ],
  });
  fixture = TestBed.createComponent(PendingGrants);
  http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  http.expectOne('/api/role-grants').flush([grant(1), MINE]);
  await turn();
});
afterEach(() => http?.verify());

describe('pending role grants', () => {
  it("when I asked for a role myself, then I cannot decide it; another person's request I can", () => {
    const [theirs, mine] = el().querySelectorAll('li');
    expect(theirs.textContent).toContain('Approver for Person 1');
    expect(button('Confirm', theirs)).toBeDefined();
    expect(mine.textContent).toContain('Another person decides on this request.');
    expect(button('Confirm', mine)).toBeUndefined();
  });

  it('when I confirm with my password, then it is sent, the page is told and the list reloads', async () => {
    const decided: RoleGrantDto[] = [];
    fixture.componentInstance.decided.subscribe((g) => decided.push(g));
    button('Confirm')!.click();
    await turn();
    type(el().querySelector('input[type="password"]')!, 'my own password');
    button('Confirm Approver')!.click();
    await tick();

    const req = http.expectOne({ method: 'POST', url: '/api/role-grants/1/confirm' });
    expect(req.request.body).toEqual({ password: 'my own password' });
    req.flush({ ...grant(1), status: 'confirmed' });
    await tick();
    http.expectOne('/api/role-grants').flush([MINE]);
    await turn();

    expect(decided.map((g) => g.status)).toEqual(['confirmed']);
    expect(el().querySelectorAll('li')).toHaveLength(1);
  });

  it('when the server refuses the password, then its reason shows beside the form', async () => {
    button('Confirm')!.click();
    await turn();
    type(el().querySelector('input[type="password"]')!, 'wrong');
    button('Confirm Approver')!.click();
    await tick();

    http
      .expectOne({ method: 'POST', url: '/api/role-grants/1/confirm' })
      .flush(
        { code: 'validation', message: 'Password is not correct', fieldErrors: { password: ['is not correct'] } },
        { status: 400, statusText: 'Bad Request' },
      );
    await turn();

    expect(el().querySelector('[role="alert"]')?.textContent).toContain('password: is not correct');
  });

  it('when I refuse with a reason, then the reason is sent', async () => {
    button('Refuse')!.click();
    await turn();
    type(el().querySelector('form input')!, 'Not yet qualified');
    button('Refuse', el().querySelector('form')!)!.click();
    await tick();

    const req = http.expectOne({ method: 'POST', url: '/api/role-grants/1/refuse' });
    expect(req.request.body).toEqual({ reason: 'Not yet qualified' });
    req.flush({ ...grant(1), status: 'refused' });
    await tick();
    http.expectOne('/api/role-grants').flush([MINE]);
    await turn();
  });
});
