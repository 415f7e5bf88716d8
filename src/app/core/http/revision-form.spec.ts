import { TestBed } from '@angular/core/testing';
import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { revisionFormInterceptor } from './revision-form';
import { encodeChecklist } from '../../../../shared/rules/stored-checklist';
import type { Checklist, ChecklistRow } from '../../../../shared/rules';

let http: HttpClient;
let backend: HttpTestingController;
beforeEach(() => {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(withInterceptors([revisionFormInterceptor])), provideHttpClientTesting()],
  });
  http = TestBed.inject(HttpClient);
  backend = TestBed.inject(HttpTestingController);
});
afterEach(() => backend.verify());

const row = (clauseId: string, status: string, at: number): ChecklistRow =>
  ({
    clauseId,
    clauseTitle: `Clause ${clauseId}`,
    reference: 'KFD-ENG-014 §4',
    severity: 'mandatory',
    status,
    location: { scope: 'segment', index: 0, at, label: `segment 1 at ${at} mm` },
    actual: 1.9,
    limit: 1.5,
    unit: '',
    utilisation: 0.79,
    utilisationBasis: null,
    message: 'safety factor 1.9 ≥ 1.5',
    warnings: [],
  }) as unknown as ChecklistRow;
const checklist = {
  rows: [row('4.1', 'pass', 0), row('4.1', 'pass', 120), row('4.2', 'fail', 0)],
  manual: [],
} as unknown as Checklist;
const meta = {
  fields: {
    SI: { tauMax: { unit: 'MPa', formula: 'τ = T·c/J' } },
    US: { tauMax: { unit: 'ksi', formula: 'τ = T·c/J' } },
  },
  methods: { section: 'J = π·d⁴/32' },
};
const storedResult = { engineVersion: '2.0.0', units: 'SI', tauMax: 41.2 };
const storedRead = () => ({ id: 5, result: storedResult, checklist: encodeChecklist(checklist), signatures: [] });
const fullRead = {
  id: 5,
  result: { ...storedResult, fields: meta.fields.SI, methods: meta.methods },
  checklist,
  signatures: [],
};

describe('a revision read in the stored form', () => {
  it('asks for the stored form and hands the page the full read, reading the engine’s units and formulas once', async () => {
    const first = firstValueFrom(http.get('/api/revisions/5'));
    const req = backend.expectOne('/api/revisions/5');
    expect(req.request.headers.get('Revision-Form')).toBe('stored');
    req.flush(storedRead());
    await Promise.resolve();
    backend.expectOne('/api/engine-metadata/2.0.0').flush(meta);
    expect(await first).toEqual(fullRead);

    const second = firstValueFrom(http.get('/api/calcs/9/latest-revision'));
    backend.expectOne('/api/calcs/9/latest-revision').flush(storedRead());
    expect(await second).toEqual(fullRead);
  });

  it('passes a read already in full, a blind read and every other request through as they are', async () => {
    const whole = firstValueFrom(http.get('/api/revisions/6'));
    backend.expectOne('/api/revisions/6').flush(fullRead);
    expect(await whole).toEqual(fullRead);
    const blind = firstValueFrom(http.get('/api/revisions/7'));
    backend.expectOne('/api/revisions/7').flush({ id: 7, result: null, checklist: null });
    expect(await blind).toEqual({ id: 7, result: null, checklist: null });

    const list = firstValueFrom(http.get('/api/revisions/7/attachments'));
    const other = backend.expectOne('/api/revisions/7/attachments');
    expect(other.request.headers.has('Revision-Form')).toBe(false);
    other.flush({ result: storedResult });
    expect(await list).toEqual({ result: storedResult });
    const sign = firstValueFrom(http.post('/api/revisions/7/sign', {}));
    const post = backend.expectOne('/api/revisions/7/sign');
    expect(post.request.headers.has('Revision-Form')).toBe(false);
    post.flush({ id: 7 });
    await sign;
  });

  it('takes a save’s answer in the stored form too', async () => {
    const save = firstValueFrom(http.put('/api/revisions/5', { lockVersion: 3 }));
    const put = backend.expectOne({ method: 'PUT', url: '/api/revisions/5' });
    expect(put.request.headers.get('Revision-Form')).toBe('stored');
    put.flush(storedRead());
    await Promise.resolve();
    backend.expectOne('/api/engine-metadata/2.0.0').flush(meta);
    expect(await save).toEqual(fullRead);
  });

  it('fails the read when the units and formulas cannot be read, and asks for them again next time', async () => {
    const first = firstValueFrom(http.get('/api/revisions/5'));
    backend.expectOne('/api/revisions/5').flush(storedRead());
    await Promise.resolve();
    backend.expectOne('/api/engine-metadata/2.0.0').flush({}, { status: 503, statusText: 'Unavailable' });
    await expect(first).rejects.toMatchObject({ status: 503 });

    const second = firstValueFrom(http.get('/api/revisions/5'));
    backend.expectOne('/api/revisions/5').flush(storedRead());
    await Promise.resolve();
    backend.expectOne('/api/engine-metadata/2.0.0').flush(meta);
    expect(await second).toEqual(fullRead);
  });
});
