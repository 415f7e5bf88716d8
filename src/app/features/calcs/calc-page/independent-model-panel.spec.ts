import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { RevisionDto } from '../../../../../shared/schemas/calc-dto';
import type { RevisionVerification } from '../../../../../shared/schemas/independent-model.schema';
import { provideRouter } from '@angular/router';
import { provideAbility } from '../../../core/authz/ability.providers';
import { IndependentModelPanel } from './independent-model-panel';

const need = {
  method: 'independent-model' as const,
  reason:
    'KFD-ENG-021 asks for an independent model for every calc: inputs equal within 0.1 % after unit conversion, results within 2 %',
  tolerances: { inputs: 0.001, results: 0.02 },
};
const checker = { id: 2, name: 'Tobias Okafor' };
const row = (key: string, label: string, author: number, theirs: number, agrees: boolean) => ({
  key,
  section: 'input' as const,
  group: 'segment' as const,
  label,
  unit: 'mm',
  author,
  checker: theirs,
  relative: Math.abs(author - theirs) / Math.max(author, theirs),
  agrees,
});

function revision(verification: RevisionVerification): RevisionDto {
  return { id: 7, calcId: 3, status: 'in_check', verification } as unknown as RevisionDto;
}

let fixture: ComponentFixture<IndependentModelPanel>;
let http: HttpTestingController;
const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

/** Mounts the panel; a panel that reads stays busy until its request is answered, so it is not awaited then. */
async function render(r: RevisionDto, canBuild = false, reads = false): Promise<void> {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideRouter([]),
      ...provideAbility(),
    ],
  });
  fixture = TestBed.createComponent(IndependentModelPanel);
  fixture.componentRef.setInput('revision', r);
  fixture.componentRef.setInput('canBuild', canBuild);
  http = TestBed.inject(HttpTestingController);
  fixture.detectChanges();
  if (!reads) await fixture.whenStable();
}

afterEach(() => http.verify());

it("when a checker has no model yet, then the panel names the required verification and says why the author's numbers are hidden", async () => {
  await render(revision({ need, blind: true, model: null, signed: null }), true);
  expect(text()).toContain('Verification required: independent model (alternate calculation)');
  expect(text()).toContain('You check this calc blind');
  expect(text()).toContain('Build independent model');
  expect(text()).toContain('Or load a calc input file');
});

it("when the reader is blind and the model is someone else's open one, then nothing is read and the summary says why", async () => {
  await render(
    revision({
      need,
      blind: true,
      model: { state: 'open', checker, lockedAt: null, agrees: null, differences: null },
      signed: null,
    }),
  );
  expect(text()).toContain('It is shown here once locked');
});

it('when the model read fails, then the panel says so inline instead of hiding it', async () => {
  await render(
    revision({
      need,
      blind: false,
      model: { state: 'locked', checker, lockedAt: '2026-12-02T07:00:00Z', agrees: true, differences: 0 },
      signed: null,
    }),
    false,
    true,
  );
  http
    .expectOne('/api/revisions/7/independent-model')
    .flush({ message: 'database unreachable' }, { status: 503, statusText: 'Unavailable' });
  fixture.detectChanges();
  await fixture.whenStable();
  expect(text()).toContain('The server failed to load the independent model');
  expect(text()).toContain('Try again');
});

it('when the model is locked with one difference, then the comparison shows both values, the gap and the caution', async () => {
  const comparison = {
    agrees: false,
    tolerances: need.tolerances,
    inputs: { compared: 2, differences: 1 },
    results: { compared: 0, differences: 0 },
    rows: [
      row('segments[2].od', 'Segment 3 outer diameter', 130, 132, false),
      row('segments[0].od', 'Segment 1 outer diameter', 100, 100, true),
    ],
  };
  await render(
    revision({
      need,
      blind: false,
      model: { state: 'locked', checker, lockedAt: '2026-12-02T07:00:00Z', agrees: false, differences: 1 },
      signed: {
        checker: checker.name,
        lockedAt: '2026-12-02T07:00:00Z',
        input: {},
        modelHash: 'a'.repeat(64),
        authorHash: 'b'.repeat(64),
        agrees: false,
        comparison,
      },
    }),
    false,
    true,
  );
  http
    .expectOne('/api/revisions/7/independent-model')
    .flush({ message: 'not yours' }, { status: 403, statusText: 'Forbidden' });
  fixture.detectChanges();
  await fixture.whenStable();
  expect(text()).toContain('1 difference:');
  expect(text()).not.toContain('segments[2].od');
  expect(text()).toContain('Segment 3 outer diameter');
  expect(text()).toContain('130 mm');
  expect(text()).toContain('132 mm');
  expect(text()).toContain('1.52 %');
  expect(text()).not.toContain('Segment 1 outer diameter');
  expect(text()).toContain('never replace');
  expect(text()).toContain('You do not have permission to see the independent model');
});
