import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import type { ActiveSessionDto } from '../../../../shared/schemas/session-list.schema';
import { SessionsPanel } from './sessions-panel';
import { browserLabel } from './browser-label';

const HERE: ActiveSessionDto = {
  id: 'a'.repeat(32),
  startedAt: '2026-12-01T08:00:00Z',
  lastSeenAt: '2026-12-01T09:30:00Z',
  ip: '127.0.0.1',
  userAgent: 'Laptop browser',
  current: true,
};
const PHONE: ActiveSessionDto = {
  id: 'b'.repeat(32),
  startedAt: '2026-11-30T07:00:00Z',
  lastSeenAt: '2026-11-30T07:05:00Z',
  ip: '192.0.2.44',
  userAgent: 'Phone browser',
  current: false,
};

let fixture: ComponentFixture<SessionsPanel>;
let http: HttpTestingController;
const el = () => fixture.nativeElement as HTMLElement;

/** Lets pending promises run without waiting for stability (an open request would hold that off). */
async function tick(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  // Resources re-fetch from an effect: run effects so a reload sends its request.
  TestBed.tick();
}

async function turn(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
  await fixture.whenStable();
}

beforeEach(async () => {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
  });
  fixture = TestBed.createComponent(SessionsPanel);
  http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  http.expectOne('/api/auth/sessions').flush([HERE, PHONE]);
  await turn();
});
afterEach(() => http?.verify());

describe('sessions panel', () => {
  it('when two sessions are listed, then each shows its browser and address, and only the other one can be ended', async () => {
    const items = el().querySelectorAll('li');
    expect(items).toHaveLength(2);
    expect(items[0].textContent).toContain('Laptop browser');
    expect(items[0].textContent).toContain('this session');
    expect(items[1].textContent).toContain('From 192.0.2.44');
    const buttons = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(
      MatButtonHarness.with({ text: 'End session' }),
    );
    expect(buttons).toHaveLength(1);
    expect(await (await buttons[0].host()).getAttribute('aria-label')).toBe(
      'End the session of Phone browser from 192.0.2.44',
    );
  });

  it('when a browser sends a full user-agent string, then a short name is shown with the full string on hover', () => {
    expect(browserLabel('Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:133.0) Gecko/20100101 Firefox/133.0')).toBe(
      'Firefox 133 on Windows',
    );
    expect(
      browserLabel(
        'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36',
      ),
    ).toBe('Chrome 131 on Linux');
    expect(browserLabel(null)).toBe('Unknown browser');
  });

  it('when the other session is ended, then the server is asked to end it and the list reloads without it', async () => {
    // A native click: a harness click waits for the app to be stable, which the pending request prevents.
    el().querySelector<HTMLButtonElement>('li:not(.current) button')!.click();
    await tick();
    http
      .expectOne({ method: 'DELETE', url: `/api/auth/sessions/${PHONE.id}` })
      .flush(null, { status: 204, statusText: 'No Content' });
    await tick();
    http.expectOne('/api/auth/sessions').flush([HERE]);
    await turn();

    expect(el().querySelectorAll('li')).toHaveLength(1);
    expect(el().querySelector('[role="alert"]')).toBeNull();
  });

  it('when ending fails, then the reason shows and the list is read again', async () => {
    // A native click: a harness click waits for the app to be stable, which the pending request prevents.
    el().querySelector<HTMLButtonElement>('li:not(.current) button')!.click();
    await tick();
    http
      .expectOne({ method: 'DELETE', url: `/api/auth/sessions/${PHONE.id}` })
      .flush({ code: 'not_found', message: 'That session was not found' }, { status: 404, statusText: 'Not Found' });
    await tick();
    http.expectOne('/api/auth/sessions').flush([HERE]);
    await turn();

    expect(el().querySelector('[role="alert"]')?.textContent).toContain('That session was not found');
  });
});
