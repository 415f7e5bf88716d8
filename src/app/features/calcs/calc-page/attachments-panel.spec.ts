import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { PureAbility } from '@casl/ability';
import { createAppAbility, defineRulesFor } from '../../../../../shared/authz/app-ability';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { AttachmentListDto } from '../../../../../shared/schemas/attachment.schema';
import { AttachmentsPanel } from './attachments-panel';
import { SessionStore } from '../../../core/auth/session-store';

const LIST: AttachmentListDto = {
  canAdd: true,
  maxBytes: 20 * 1024 * 1024,
  acceptedTypes: ['PDF', 'PNG'],
  items: [
    {
      id: 4,
      revisionId: 7,
      kind: 'drawing',
      fileName: 'DRG-7 sheet 1.pdf',
      mediaType: 'application/pdf',
      sizeBytes: 4096,
      sha256: 'ab'.repeat(32),
      note: '',
      uploadedBy: { id: 1, name: 'Morwenna Hale' },
      createdAt: '2026-12-01T10:00:00Z',
    },
  ],
};
const REVISION = {
  id: 7,
  calcId: 3,
  status: 'draft',
  checklist: {
    manual: [
      { id: 'material-certificate', requiresAttachment: 'material-certificate' },
      { id: 'drawing-reference', requiresAttachment: 'drawing' },
    ],
  },
} as unknown as RevisionDto;

let fixture: ComponentFixture<AttachmentsPanel>;
let http: HttpTestingController;

async function turn(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
  await fixture.whenStable();
}

beforeEach(async () => {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      { provide: PureAbility, useValue: createAppAbility(defineRulesFor({ id: 1, roles: ['author'] })) },
    ],
  });
  fixture = TestBed.createComponent(AttachmentsPanel);
  fixture.componentRef.setInput('revision', REVISION);
  http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  http.expectOne('/api/revisions/7/attachments').flush(LIST);
  await turn();
});
afterEach(() => http?.verify());

describe('attachments panel', () => {
  it('when a file is small, then its size reads in bytes or kB, never "0 kB"; the author of a draft may remove it', async () => {
    const el = fixture.nativeElement as HTMLElement;
    expect(el.textContent).toContain('application/pdf · 4.0 kB ·');
    const session = TestBed.inject(SessionStore);
    const load = session.load();
    http.expectOne('/api/session').flush({
      user: { id: 1, username: 'mhale', displayName: 'Morwenna Hale', roles: ['author'] },
      rules: [],
      csrfToken: 't',
    });
    await load;
    fixture.componentRef.setInput('revision', { ...REVISION, id: 8, author: { id: 1, name: 'Morwenna Hale' } });
    fixture.detectChanges();
    http
      .expectOne('/api/revisions/8/attachments')
      .flush({ ...LIST, items: [{ ...LIST.items[0], sizeBytes: 212, uploadedBy: { id: 5, name: 'A co-editor' } }] });
    await turn();
    expect(el.textContent).toContain('application/pdf · 212 bytes ·');
    expect(
      await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatButtonHarness.with({ text: /Remove/ })),
    ).toHaveLength(1);
  });

  it('when a drawing is attached but no certificate, then the file is a download link and the missing kind is named', () => {
    const el = fixture.nativeElement as HTMLElement;
    const link = el.querySelector('a[download]') as HTMLAnchorElement;
    expect(link.textContent).toBe('DRG-7 sheet 1.pdf');
    expect(link.getAttribute('href')).toBe('/api/attachments/4');
    expect(el.querySelector('[role="status"]')?.textContent).toContain('asks for: material certificate.');
  });

  it('when the server refuses a file by its content, then its reason shows beside the form', async () => {
    const input = (fixture.nativeElement as HTMLElement).querySelector('input[type="file"]') as HTMLInputElement;
    Object.defineProperty(input, 'files', { value: { item: () => new File(['MZ'], 'drawing.pdf') } });
    input.dispatchEvent(new Event('change'));
    const attach = await TestbedHarnessEnvironment.loader(fixture).getHarness(
      MatButtonHarness.with({ text: /Attach/ }),
    );

    await attach.click();
    http
      .expectOne({ method: 'POST', url: '/api/revisions/7/attachments' })
      .flush(
        { code: 'validation', message: 'Invalid input', fieldErrors: { file: ['its content is a Windows program'] } },
        { status: 400, statusText: 'Bad Request' },
      );
    await turn();

    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toBe(
      'The file its content is a Windows program',
    );
  });
});
