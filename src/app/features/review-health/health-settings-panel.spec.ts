import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HEALTH_SETTING_FIELDS, type HealthSettingsDto } from '../../../../shared/schemas/review-health.schema';
import { HealthSettingsPanel } from './health-settings-panel';

const STORED: HealthSettingsDto = {
  quickCheckSecondsPerItem: 20,
  silentCheckerChecks: 10,
  pairingSharePercent: 75,
  pairingMinChecks: 5,
  refusalRepeatCount: 3,
  replacedWithinDays: 30,
  lockVersion: 4,
  updatedAt: '2026-12-01T08:00:00Z',
  updatedBy: 'Priya Raman',
};

let fixture: ComponentFixture<HealthSettingsPanel>;
let http: HttpTestingController;
const el = () => fixture.nativeElement as HTMLElement;
// Inputs in the form's order, which is the order of the shared field list.
const input = (name: keyof typeof HEALTH_SETTING_FIELDS) =>
  el().querySelectorAll('input')[Object.keys(HEALTH_SETTING_FIELDS).indexOf(name)] as HTMLInputElement;
const submit = () => (el().querySelector('button[type="submit"]') as HTMLButtonElement).click();

async function turn(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
  await fixture.whenStable();
}

beforeEach(async () => {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
  });
  fixture = TestBed.createComponent(HealthSettingsPanel);
  http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  http.expectOne('/api/review-health/settings').flush(STORED);
  await turn();
});
afterEach(() => http?.verify());

describe('review-health thresholds form', () => {
  it('when loaded, then each field shows the stored value and who changed them last', () => {
    expect(input('pairingSharePercent').value).toBe('75');
    expect(el().textContent).toContain('by Priya Raman');
  });

  it('when the stored values have not arrived, then the fields take no typing until they do', async () => {
    const early = TestBed.createComponent(HealthSettingsPanel);
    early.detectChanges();
    const fields = () => Array.from((early.nativeElement as HTMLElement).querySelectorAll('input'));
    const share = () => fields()[Object.keys(HEALTH_SETTING_FIELDS).indexOf('pairingSharePercent')];
    expect(fields().filter((f) => !f.disabled)).toEqual([]);
    http.expectOne('/api/review-health/settings').flush(STORED);
    await new Promise((resolve) => setTimeout(resolve));
    early.detectChanges();
    expect([share().disabled, share().value]).toEqual([false, '75']);
  });

  it('when a value is out of range, then the field says so inline and nothing is sent', async () => {
    input('pairingSharePercent').value = '120';
    input('pairingSharePercent').dispatchEvent(new Event('input'));
    submit();
    await turn();
    expect(el().querySelector('mat-error')?.textContent).toContain(
      'Share of one author’s checks done by one checker (%): enter a whole number from 50 to 100',
    );
    http.expectNone('/api/review-health/settings');
  });

  it('when the server refuses a field, then its words appear at that field', async () => {
    input('replacedWithinDays').value = '40';
    input('replacedWithinDays').dispatchEvent(new Event('input'));
    submit();
    const req = http.expectOne({ method: 'PUT', url: '/api/review-health/settings' });
    expect(req.request.body).toMatchObject({ replacedWithinDays: 40, lockVersion: 4 });
    req.flush(
      {
        code: 'validation',
        message: 'Invalid input',
        fieldErrors: {
          replacedWithinDays: ['Days before a standard version was replaced: must be a whole number from 1 to 3,650'],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await turn();
    input('replacedWithinDays').dispatchEvent(new Event('blur'));
    await turn();
    expect(el().querySelector('mat-error')?.textContent).toContain('must be a whole number from 1 to 3,650');
    expect(el().querySelector('[role="alert"]')?.textContent).toContain('Invalid input');
  });
});
